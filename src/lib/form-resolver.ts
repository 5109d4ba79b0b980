import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldValues, Resolver } from 'react-hook-form';
import type { z } from 'zod';

/**
 * zodResolver of a contract schema run on the request body the form's values make (`toBody` drops what was left
 * blank, for example), so the form checks exactly what the server will. Error paths are the body's, which are the
 * form's own where `toBody` keeps the shape.
 */
export function bodyResolver<TForm extends FieldValues, TSchema extends z.ZodType>(
  schema: TSchema,
  toBody: (values: TForm) => z.input<TSchema>,
): Resolver<TForm, unknown, z.output<TSchema>> {
  const resolve = zodResolver(schema as never) as unknown as Resolver<FieldValues, unknown, z.output<TSchema>>;
  return (values, context, options) => resolve(toBody(values) as FieldValues, context, options as never) as never;
}

/** A copy without the keys whose value is undefined, '' or an empty tuple of such values (left blank in a form). */
export function dropBlank<T extends Record<string, unknown>>(value: T): T {
  const blank = (entry: unknown) => entry === undefined || entry === '';
  const result: Record<string, unknown> = {};
  for (const [key, entry] of Object.entries(value)) {
    if (blank(entry)) continue;
    if (Array.isArray(entry) && entry.every(blank)) continue;
    result[key] = entry;
  }
  return result as T;
}

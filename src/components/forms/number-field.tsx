import type { ReactNode } from 'react';
import { get, type FieldErrors, type FieldValues, type Path, type UseFormRegister } from 'react-hook-form';
import { numberOrUndefined } from '../../lib/form-values';
import { TextField } from '../ui/field';

interface NumberFieldProps<T extends FieldValues> {
  /** The value's path in the form, e.g. `source.lengthM`: SI, as the contract names it. */
  name: Path<T>;
  register: UseFormRegister<T>;
  errors: FieldErrors<T>;
  id: string;
  label: string;
  hint?: ReactNode;
  optional?: boolean;
  /** Whole numbers (a numeric keypad on phones); decimals otherwise. */
  whole?: boolean;
}

/**
 * A number box of a react-hook-form form: an empty box reads as "not given" (so the schema says "is required" or
 * leaves an optional value out), and the error shown is the one at its path, from the schema or the server.
 */
export function NumberField<T extends FieldValues>({ name, register, errors, whole, ...field }: NumberFieldProps<T>) {
  const error = (get(errors, name) as { message?: string } | undefined)?.message;
  return <TextField {...field} inputMode={whole ? 'numeric' : 'decimal'} error={error} {...register(name, { setValueAs: numberOrUndefined })} />;
}

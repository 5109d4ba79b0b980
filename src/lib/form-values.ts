/**
 * Reading number inputs into form values: an empty box is "not given" (undefined), so that the contract schema says
 * "is required" for a required field and leaves an optional one out; anything else becomes a number (NaN for text
 * that is none, which the schema refuses as "must be a number").
 */
export function numberOrUndefined(value: unknown): number | undefined {
  if (value === undefined || value === null) return undefined;
  if (typeof value === 'number') return value;
  const text = String(value).trim();
  return text === '' ? undefined : Number(text);
}

/** A stored optional number as the text of its input ('' when absent). */
export function numberText(value: number | null | undefined): string {
  return value === null || value === undefined ? '' : String(value);
}

/**
 * Helpers of the edit forms: what changed between a stored thing and the form's values, and which refusal of a save
 * the page answers with its own words (a version conflict, an approved design) rather than under a field.
 */
import { isApiError } from '../../lib/api-client';

/** Deep equality of JSON-like values (numbers, text, booleans, null, arrays, plain objects); key order is ignored. */
export function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) || Array.isArray(b)) {
    return Array.isArray(a) && Array.isArray(b) && a.length === b.length && a.every((entry, index) => sameValue(entry, b[index]));
  }
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return false;
  const left = Object.entries(a as Record<string, unknown>).filter(([, value]) => value !== undefined);
  const right = Object.entries(b as Record<string, unknown>).filter(([, value]) => value !== undefined);
  if (left.length !== right.length) return false;
  const other = b as Record<string, unknown>;
  return left.every(([key, value]) => sameValue(value, other[key]));
}

/** Whether a PATCH body names anything to change besides the version it was read at. */
export function changesSomething(body: { version: number }): boolean {
  return Object.entries(body).some(([key, value]) => key !== 'version' && value !== undefined);
}

/** A refused save that the edit form explains in its own words. */
export type SaveRefusal = { kind: 'conflict' } | { kind: 'frozen'; message: string };

/**
 * 409 `version_conflict` (someone saved the thing after the form was opened) and 409 `approved_design_frozen` (an
 * approved design rests on it); anything else is null and goes under its fields or in the form's error notice.
 */
export function saveRefusalOf(error: unknown): SaveRefusal | null {
  if (!isApiError(error) || error.status !== 409) return null;
  if (error.code === 'version_conflict') return { kind: 'conflict' };
  if (error.code === 'approved_design_frozen') return { kind: 'frozen', message: error.message };
  return null;
}

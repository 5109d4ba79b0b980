/**
 * Which tuning variants use a mode, a load case or comfort criteria: the services of those things refuse to delete
 * one in use (409 naming the variants). The foreign keys of `tuning_variants` refuse it too, for a variant created
 * in between (then the answer is the same 409 without the names read first).
 */
import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { structureModes, tuningVariantLoadCases, tuningVariants } from '../../db/schema';
import { HttpError } from '../../lib/http-error';
import { FOREIGN_KEY_VIOLATION, pgErrorCode } from '../../lib/pg-errors';

export interface VariantUse {
  id: string;
  name: string;
}

export type VariantUseFilter = { modeId: string } | { structureId: string } | { loadCaseId: string } | { criteriaId: string };

export async function variantsUsing(db: Executor, filter: VariantUseFilter): Promise<VariantUse[]> {
  const columns = { id: tuningVariants.id, name: tuningVariants.name };
  if ('modeId' in filter) return db.select(columns).from(tuningVariants).where(eq(tuningVariants.modeId, filter.modeId)).orderBy(asc(tuningVariants.name));
  if ('criteriaId' in filter) return db.select(columns).from(tuningVariants).where(eq(tuningVariants.criteriaId, filter.criteriaId)).orderBy(asc(tuningVariants.name));
  if ('structureId' in filter) {
    return db
      .select(columns)
      .from(tuningVariants)
      .where(inArray(tuningVariants.modeId, db.select({ id: structureModes.id }).from(structureModes).where(eq(structureModes.structureId, filter.structureId))))
      .orderBy(asc(tuningVariants.name));
  }
  return db
    .selectDistinct(columns)
    .from(tuningVariants)
    .innerJoin(tuningVariantLoadCases, and(eq(tuningVariantLoadCases.variantId, tuningVariants.id), eq(tuningVariantLoadCases.loadCaseId, filter.loadCaseId)))
    .orderBy(asc(tuningVariants.name));
}

/** 409 `in_use_by_variants` naming the variants that use the thing. */
export function inUseByVariants(what: string, uses: readonly VariantUse[]): HttpError {
  const names = uses.map((u) => `"${u.name}"`).join(', ');
  const message = uses.length
    ? `${what} is used by the tuning variant${uses.length > 1 ? 's' : ''} ${names}; change or delete ${uses.length > 1 ? 'them' : 'it'} first`
    : `${what} is used by a tuning variant; change or delete it first`;
  return new HttpError(409, 'in_use_by_variants', message, uses.length ? uses.map((u) => ({ path: `variants.${u.id}`, message: `used by the tuning variant "${u.name}" (${u.id})` })) : [{ path: '', message }]);
}

/** Refuses (409) when a variant uses the thing; else runs the delete, turning a foreign-key refusal into the same 409. */
export async function deleteUnlessUsedByVariants<T>(db: Executor, what: string, filter: VariantUseFilter, remove: () => Promise<T>): Promise<T> {
  const uses = await variantsUsing(db, filter);
  if (uses.length) throw inUseByVariants(what, uses);
  try {
    return await remove();
  } catch (error) {
    if (pgErrorCode(error) === FOREIGN_KEY_VIOLATION) throw inUseByVariants(what, await variantsUsing(db, filter));
    throw error;
  }
}

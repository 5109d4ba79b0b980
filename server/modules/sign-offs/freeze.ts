/**
 * An approved design is frozen: its variant, the variant's mode, load cases and comfort criteria refuse every change
 * and delete (409 `approved_design_frozen`). The services ask first; the triggers of migration 0006 refuse the same
 * writes in the database (SQLSTATE SO409), which `frozenWrite` turns into the same answer.
 */
import { and, eq, exists, sql } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { signOffs, tuningVariantLoadCases, tuningVariants } from '../../db/schema';
import { HttpError } from '../../lib/http-error';
import { pgErrorCode } from '../../lib/pg-errors';

export const FROZEN_SQLSTATE = 'SO409';

export type FrozenTarget = { variantId: string } | { modeId: string } | { loadCaseId: string } | { criteriaId: string };

/** A project holding an approved design is kept with it. */
export function projectHoldsApprovedDesign(): HttpError {
  const message = 'The project holds a design the owner approved and cannot be deleted; its approval and the design it rests on are kept';
  return new HttpError(409, 'approved_design_frozen', message, [{ path: '', message }]);
}

export function frozenError(what: string): HttpError {
  const message = `${what} belongs to a design the owner approved and cannot be changed or deleted; copy the variant and submit again`;
  return new HttpError(409, 'approved_design_frozen', message, [{ path: '', message }]);
}

/** Whether an approved sign-off rests on the target. */
export async function isFrozen(db: Executor, target: FrozenTarget): Promise<boolean> {
  const approved = eq(signOffs.status, 'approved');
  let condition;
  if ('variantId' in target) condition = and(approved, eq(signOffs.variantId, target.variantId));
  else if ('criteriaId' in target) condition = and(approved, eq(signOffs.criteriaId, target.criteriaId));
  else if ('modeId' in target) {
    condition = and(
      approved,
      exists(db.select({ one: sql`1` }).from(tuningVariants).where(and(eq(tuningVariants.id, signOffs.variantId), eq(tuningVariants.modeId, target.modeId)))),
    );
  } else {
    condition = and(
      approved,
      exists(
        db
          .select({ one: sql`1` })
          .from(tuningVariantLoadCases)
          .where(and(eq(tuningVariantLoadCases.variantId, signOffs.variantId), eq(tuningVariantLoadCases.loadCaseId, target.loadCaseId))),
      ),
    );
  }
  const rows = await db.select({ id: signOffs.id }).from(signOffs).where(condition).limit(1);
  return rows.length > 0;
}

/**
 * 409 when an approved sign-off rests on the target; `inScope` (asked only then) says whether the person may see it,
 * so that another organisation's frozen row stays a 404 of the caller's own making.
 */
export async function refuseIfFrozen(db: Executor, what: string, target: FrozenTarget, inScope?: () => Promise<unknown>): Promise<void> {
  if (!(await isFrozen(db, target))) return;
  if (inScope && !(await inScope())) return;
  throw frozenError(what);
}

/** Runs a write; the database's freeze (a design approved meanwhile) becomes the same 409. */
export async function frozenWrite<T>(what: string | HttpError, write: () => Promise<T>): Promise<T> {
  try {
    return await write();
  } catch (error) {
    if (pgErrorCode(error) === FROZEN_SQLSTATE) throw typeof what === 'string' ? frozenError(what) : what;
    throw error;
  }
}

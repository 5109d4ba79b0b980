import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { comfortCriteria, memberships, outbox, projects, signOffs, users } from '../../db/schema';
import type { SignOffSnapshot } from '../../../shared/contracts/sign-offs';
import { inProject, type ProjectScope } from '../structures/structures.repository';

export type SignOffRow = typeof signOffs.$inferSelect;
export type OutboxRow = typeof outbox.$inferSelect;

export async function listSignOffs(db: Executor, scope: ProjectScope): Promise<SignOffRow[]> {
  return db.select().from(signOffs).where(inProject(db, signOffs.projectId, scope)).orderBy(desc(signOffs.submittedAt), desc(signOffs.id));
}

export async function findSignOff(db: Executor, scope: ProjectScope, id: string): Promise<SignOffRow | undefined> {
  const [row] = await db
    .select()
    .from(signOffs)
    .where(and(eq(signOffs.id, id), inProject(db, signOffs.projectId, scope)))
    .limit(1);
  return row;
}

export async function findUndecided(db: Executor, variantId: string): Promise<SignOffRow | undefined> {
  const [row] = await db
    .select()
    .from(signOffs)
    .where(and(eq(signOffs.variantId, variantId), eq(signOffs.status, 'submitted')))
    .limit(1);
  return row;
}

export async function insertSignOff(
  db: Executor,
  scope: ProjectScope,
  values: { variantId: string; criteriaId: string; message: string | null; submittedBy: string; snapshot: SignOffSnapshot },
): Promise<SignOffRow> {
  const [row] = await db
    .insert(signOffs)
    .values({ ...values, projectId: scope.projectId })
    .returning();
  return row;
}

/** The decision, only while the sign-off is still undecided: no row means it was decided already (or is not there). */
export async function decide(
  db: Executor,
  scope: ProjectScope,
  id: string,
  values: {
    status: 'approved' | 'returned';
    decidedBy: string;
    decisionComment: string | null;
    /** The decider's name and e-mail and the project's name as they are now, kept with the decision. */
    decidedByName: string | null;
    decidedByEmail: string;
    decidedProjectName: string;
  },
): Promise<SignOffRow | undefined> {
  const [row] = await db
    .update(signOffs)
    .set({ ...values, decidedAt: sql`now()`, version: sql`${signOffs.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(signOffs.id, id), eq(signOffs.status, 'submitted'), inProject(db, signOffs.projectId, scope)))
    .returning();
  return row;
}

/**
 * Sets the criteria's status to the sign-off's, except that criteria an approved sign-off rests on stay `approved`
 * (another design using them may be submitted or returned later). The database's freeze lets only this change
 * through, under the transaction-local `stillspan.sign_off`.
 */
export async function setCriteriaStatus(db: Executor, criteriaId: string, status: 'submitted' | 'approved' | 'returned'): Promise<void> {
  await db.execute(sql`select set_config('stillspan.sign_off', 'on', true)`);
  const approvedOnes = db
    .select({ one: sql`1` })
    .from(signOffs)
    .where(and(eq(signOffs.criteriaId, criteriaId), eq(signOffs.status, 'approved')));
  await db
    .update(comfortCriteria)
    .set({
      status: sql`case when exists (${approvedOnes}) then 'approved'::comfort_criteria_status else ${status}::comfort_criteria_status end`,
      version: sql`${comfortCriteria.version} + 1`,
      updatedAt: sql`now()`,
    })
    .where(eq(comfortCriteria.id, criteriaId));
  await db.execute(sql`select set_config('stillspan.sign_off', '', true)`);
}

export function ownersOf(db: Executor, organisationId: string) {
  return db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.role, 'owner')))
    .orderBy(asc(users.email));
}

export async function findUser(db: Executor, id: string) {
  const [row] = await db.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, id)).limit(1);
  return row;
}

export async function projectName(db: Executor, projectId: string): Promise<string> {
  const [row] = await db.select({ name: projects.name }).from(projects).where(eq(projects.id, projectId)).limit(1);
  return row?.name ?? '';
}

export function mailsOf(db: Executor, signOffIds: readonly string[]) {
  if (!signOffIds.length) return Promise.resolve([] as OutboxRow[]);
  return db.select().from(outbox).where(inArray(outbox.signOffId, [...signOffIds])).orderBy(asc(outbox.createdAt), asc(outbox.toAddress));
}

/**
 * Share-locks the rows a submission rests on (variant, its load-case links, mode, load cases, criteria) for the rest of
 * the transaction, and returns their versions now: a change made meanwhile waits, then meets the freeze.
 */
export async function lockedVersions(db: Executor, snapshot: SignOffSnapshot) {
  const variantId = snapshot.variant.id;
  const variant = await db.execute<{ version: number }>(sql`select version from tuning_variants where id = ${variantId} for share`);
  const links = await db.execute<{ load_case_id: string }>(
    sql`select load_case_id from tuning_variant_load_cases where variant_id = ${variantId} order by position for share`,
  );
  const mode = await db.execute<{ version: number }>(sql`select version from structure_modes where id = ${snapshot.mode.id} for share`);
  const ids = snapshot.loadCases.map((l) => l.id);
  const loadCaseRows = ids.length
    ? await db.execute<{ id: string; version: number }>(sql`select id, version from load_cases where id in (${sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)}) for share`)
    : { rows: [] as { id: string; version: number }[] };
  // The criteria's version moves with its status (the sign-off's own change), so its content is compared instead.
  const criteria = await db.execute<{ same: boolean }>(
    sql`select (name = ${snapshot.criteria.name} and spec = ${JSON.stringify(snapshot.criteria.spec)}::jsonb) as same from comfort_criteria where id = ${snapshot.criteria.id} for share`,
  );
  return {
    variantVersion: variant.rows[0]?.version,
    loadCaseIds: links.rows.map((r) => r.load_case_id),
    modeVersion: mode.rows[0]?.version,
    loadCaseVersions: new Map(loadCaseRows.rows.map((r) => [r.id, r.version])),
    criteriaUnchanged: criteria.rows[0]?.same === true,
  };
}

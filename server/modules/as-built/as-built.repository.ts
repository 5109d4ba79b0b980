import { and, desc, eq } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { asBuiltRecords, users } from '../../db/schema';
import type { AsBuiltUnit } from '../../../shared/contracts/as-built';
import { inProject, type ProjectScope } from '../structures/structures.repository';

export type AsBuiltRow = typeof asBuiltRecords.$inferSelect & { recordedByName: string | null };

const columns = {
  id: asBuiltRecords.id,
  projectId: asBuiltRecords.projectId,
  signOffId: asBuiltRecords.signOffId,
  units: asBuiltRecords.units,
  note: asBuiltRecords.note,
  recordedBy: asBuiltRecords.recordedBy,
  recordedAt: asBuiltRecords.recordedAt,
  recordedByName: users.name,
};

/** The sign-off's records, newest first, with the name of whoever recorded each (null once their account is gone). */
export async function listRecords(db: Executor, scope: ProjectScope, signOffId: string): Promise<AsBuiltRow[]> {
  return db
    .select(columns)
    .from(asBuiltRecords)
    .leftJoin(users, eq(users.id, asBuiltRecords.recordedBy))
    .where(and(eq(asBuiltRecords.signOffId, signOffId), inProject(db, asBuiltRecords.projectId, scope)))
    .orderBy(desc(asBuiltRecords.recordedAt), desc(asBuiltRecords.id));
}

export async function insertRecord(
  db: Executor,
  scope: ProjectScope,
  values: { signOffId: string; units: AsBuiltUnit[]; note: string | null; recordedBy: string },
): Promise<typeof asBuiltRecords.$inferSelect> {
  const [row] = await db
    .insert(asBuiltRecords)
    .values({ ...values, projectId: scope.projectId })
    .returning();
  return row;
}

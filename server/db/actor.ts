/**
 * Who makes a change, for the project's history (docs/decisions/0020-history.md). The history triggers of migration
 * 0009 read the person from the transaction-local setting `stillspan.actor`; `asActor` opens a transaction (a savepoint
 * when `db` already is one), sets it, and runs the work in it, so the change and its history entry commit or fail
 * together. A write made without it is still recorded, with no person.
 */
import { sql } from 'drizzle-orm';
import type { Executor } from './executor';

export const ACTOR_SETTING = 'stillspan.actor';

export async function asActor<T>(db: Executor, actor: { id: string }, work: (tx: Executor) => Promise<T>): Promise<T> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select set_config(${ACTOR_SETTING}, ${actor.id}, true)`);
    return work(tx);
  });
}

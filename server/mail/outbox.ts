/**
 * The mail outbox: mails written in the transaction of the change they announce, sent after commit and again by a
 * periodic relay with backoff, so that a mail relay that is down never loses a decision. A mail is claimed by moving
 * its next attempt forward (so two relays never send it at once), sent, and marked `sent`; a failure counts the
 * attempt and schedules the next one 30 s × 2^(attempts − 1) later (at most an hour); after 10 attempts it is `failed`.
 */
import { sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import type { Executor } from '../db/executor';
import { outbox } from '../db/schema';
import type { Mailer, OutgoingMail } from './mailer';

export const outboxMaxAttempts = 10;
const firstRetryS = 30;
const longestRetryS = 3600;
/** How long a claimed mail stays away from other relays while it is being sent. */
const claimS = 120;

/** Seconds before the next attempt after `attempts` failed ones. */
export function retryDelayS(attempts: number): number {
  return Math.min(longestRetryS, firstRetryS * 2 ** Math.max(0, attempts - 1));
}

export async function enqueueMails(db: Executor, signOffId: string | null, mails: readonly OutgoingMail[]): Promise<string[]> {
  if (!mails.length) return [];
  const rows = await db
    .insert(outbox)
    .values(mails.map((m) => ({ signOffId, toAddress: m.to, subject: m.subject, textBody: m.text, htmlBody: m.html ?? null })))
    .returning({ id: outbox.id });
  return rows.map((r) => r.id);
}

type ClaimedMail = {
  id: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  attempts: number;
};

/**
 * Sends the pending mails that are due (`ids`: only those; `dueOrNot`: also those waiting for their next attempt).
 * Returns how many were sent.
 */
export async function drainOutbox(db: Database, mailer: Mailer, options: { ids?: readonly string[]; dueOrNot?: boolean; limit?: number } = {}): Promise<number> {
  if (options.ids && !options.ids.length) return 0;
  const due = options.dueOrNot ? sql`true` : sql`next_attempt_at <= now()`;
  const only = options.ids ? sql`and id in (${sql.join(options.ids.map((id) => sql`${id}::uuid`), sql`, `)})` : sql``;
  const claimed = await db.execute<ClaimedMail>(sql`
    update outbox set next_attempt_at = now() + make_interval(secs => ${claimS})
    where id in (
      select id from outbox where state = 'pending' and ${due} ${only}
      order by created_at limit ${options.limit ?? 50} for update skip locked
    )
    returning id, to_address, subject, text_body, html_body, attempts`);
  let sent = 0;
  for (const mail of claimed.rows) {
    try {
      await mailer.send({ to: mail.to_address, subject: mail.subject, text: mail.text_body, ...(mail.html_body ? { html: mail.html_body } : {}) });
      await db.execute(sql`update outbox set state = 'sent', attempts = attempts + 1, sent_at = now(), last_error = null where id = ${mail.id}`);
      sent++;
    } catch (error) {
      const attempts = mail.attempts + 1;
      const state = attempts >= outboxMaxAttempts ? 'failed' : 'pending';
      await db.execute(sql`
        update outbox set attempts = ${attempts}, state = ${state}, last_error = ${(error as Error).message.slice(0, 500)},
          next_attempt_at = now() + make_interval(secs => ${retryDelayS(attempts)})
        where id = ${mail.id}`);
    }
  }
  return sent;
}

export interface OutboxRelay {
  /** Sends what is due now (also what `ids` names), without waiting for the next period. */
  drain(ids?: readonly string[]): Promise<void>;
  stop(): Promise<void>;
}

/** Drains the outbox every `periodMs` until stopped; a failing drain is reported and retried next period. */
export function startOutboxRelay(db: Database, mailer: Mailer, options: { periodMs: number; log?: (line: string) => void }): OutboxRelay {
  let running: Promise<unknown> = Promise.resolve();
  let stopped = false;
  const run = (work: () => Promise<unknown>) => {
    running = running.then(work).catch((error: unknown) => options.log?.(`mail outbox: ${(error as Error).message}`));
    return running.then(() => undefined);
  };
  const timer = setInterval(() => {
    if (!stopped) void run(() => drainOutbox(db, mailer));
  }, options.periodMs);
  timer.unref();
  return {
    drain(ids) {
      if (stopped) return Promise.resolve();
      return run(() => drainOutbox(db, mailer, ids ? { ids } : {}));
    },
    async stop() {
      stopped = true;
      clearInterval(timer);
      await running;
    },
  };
}

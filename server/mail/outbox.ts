/**
 * The mail outbox: mails written in the transaction of the change they announce, sent after commit and again by a
 * periodic relay with backoff, so that a mail relay that is down never loses a decision. A mail is claimed by moving
 * its next attempt forward (so two relays never send it at once), sent, and marked `sent`; a failure (or a relay that
 * does not accept the mail within 15 s) counts the attempt and schedules the next one 30 s × 2^(attempts − 1) later
 * (at most an hour); after 10 attempts it is `failed`; after a time-out the rest of the round waits 30 s uncounted.
 * The request that wrote the mails does not wait for the relay: the send after commit runs in the background.
 */
import { sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import type { Executor } from '../db/executor';
import { outbox } from '../db/schema';
import type { Mailer, OutgoingMail } from './mailer';

export const outboxMaxAttempts = 10;
const firstRetryS = 30;
const longestRetryS = 3600;
/** Room left after the slowest round, so that a claim outlives its round with time to mark the last mail. */
const claimMarginS = 60;
/** Mails claimed in one round unless told otherwise. */
const defaultRoundSize = 50;

/**
 * How long the mails claimed in one round stay away from other relays: the slowest round (each of its mails sent just
 * within the time limit) and a margin, so that a second relay never sends again a mail this round still holds.
 */
export function claimSecondsFor(roundSize: number, sendTimeoutMs: number): number {
  return Math.ceil((roundSize * sendTimeoutMs) / 1000) + claimMarginS;
}

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

/** How long one mail may take at the relay before the attempt counts as failed (our own choice). */
export const defaultSendTimeoutMs = 15_000;

/** The mailer's send, given up after `timeoutMs` (a relay that accepts the connection and then hangs). */
class RelayTimeout extends Error {}

function sendWithin(mailer: Mailer, mail: OutgoingMail, timeoutMs: number): Promise<void> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new RelayTimeout(`the mail relay did not accept the mail within ${timeoutMs / 1000} s`)), timeoutMs);
  });
  const sending = mailer.send(mail);
  // A send that ends after the timeout is not waited for; its late failure is not reported twice.
  sending.catch(() => undefined);
  return Promise.race([sending, timeout]).finally(() => clearTimeout(timer));
}

/**
 * Sends the pending mails that are due (`ids`: only those; `dueOrNot`: also those waiting for their next attempt).
 * Each send is given up after `sendTimeoutMs` and counted as a failed attempt; after such a time-out (the relay hangs)
 * the rest of the batch is not tried now but waits for the first retry delay with no attempt counted, and so does the
 * rest when `stopping()` turns true. Returns how many were sent.
 */
export async function drainOutbox(
  db: Database,
  mailer: Mailer,
  options: { ids?: readonly string[]; dueOrNot?: boolean; limit?: number; sendTimeoutMs?: number; stopping?: () => boolean } = {},
): Promise<number> {
  if (options.ids && !options.ids.length) return 0;
  const due = options.dueOrNot ? sql`true` : sql`next_attempt_at <= now()`;
  const only = options.ids ? sql`and id in (${sql.join(options.ids.map((id) => sql`${id}::uuid`), sql`, `)})` : sql``;
  const roundSize = options.limit ?? defaultRoundSize;
  const sendTimeoutMs = options.sendTimeoutMs ?? defaultSendTimeoutMs;
  const claimed = await db.execute<ClaimedMail>(sql`
    update outbox set next_attempt_at = now() + make_interval(secs => ${claimSecondsFor(roundSize, sendTimeoutMs)})
    where id in (
      select id from outbox where state = 'pending' and ${due} ${only}
      order by created_at limit ${roundSize} for update skip locked
    )
    returning id, to_address, subject, text_body, html_body, attempts`);
  let sent = 0;
  let giveUpRest = false;
  for (const mail of claimed.rows) {
    if (giveUpRest || options.stopping?.()) {
      await db.execute(sql`update outbox set next_attempt_at = now() + make_interval(secs => ${firstRetryS}) where id = ${mail.id} and state = 'pending'`);
      continue;
    }
    try {
      const outgoing = { to: mail.to_address, subject: mail.subject, text: mail.text_body, ...(mail.html_body ? { html: mail.html_body } : {}) };
      await sendWithin(mailer, outgoing, sendTimeoutMs);
      await db.execute(sql`update outbox set state = 'sent', attempts = attempts + 1, sent_at = now(), last_error = null where id = ${mail.id}`);
      sent++;
    } catch (error) {
      if (error instanceof RelayTimeout) giveUpRest = true;
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
  /**
   * Starts sending the named mails (and whatever else is due) in the background and returns at once: a request that
   * wrote mails answers without waiting for the relay. Their state reads `pending` until the attempt ends.
   */
  sendSoon(ids: readonly string[]): void;
  /** Sends what is due now (also what `ids` names), without waiting for the next period; resolves when done. */
  drain(ids?: readonly string[]): Promise<void>;
  /** Resolves when every send started so far has ended. */
  idle(): Promise<void>;
  stop(): Promise<void>;
}

/**
 * Drains the outbox every `periodMs` until stopped, one drain at a time; a failing drain is reported and retried next
 * period. `sendTimeoutMs` bounds each mail's attempt (default 15 s).
 */
export function startOutboxRelay(
  db: Database,
  mailer: Mailer,
  options: { periodMs: number; sendTimeoutMs?: number; log?: (line: string) => void },
): OutboxRelay {
  let running: Promise<unknown> = Promise.resolve();
  let stopped = false;
  const drainOptions = (ids?: readonly string[]) => ({
    ...(ids ? { ids } : {}),
    sendTimeoutMs: options.sendTimeoutMs ?? defaultSendTimeoutMs,
    stopping: () => stopped,
  });
  const run = (work: () => Promise<unknown>) => {
    running = running.then(work).catch((error: unknown) => options.log?.(`mail outbox: ${(error as Error).message}`));
    return running.then(() => undefined);
  };
  const timer = setInterval(() => {
    if (!stopped) void run(() => drainOutbox(db, mailer, drainOptions()));
  }, options.periodMs);
  timer.unref();
  return {
    sendSoon(ids) {
      if (stopped || !ids.length) return;
      void run(() => drainOutbox(db, mailer, drainOptions(ids)));
    },
    drain(ids) {
      if (stopped) return Promise.resolve();
      return run(() => drainOutbox(db, mailer, drainOptions(ids)));
    },
    idle() {
      return running.then(() => undefined);
    },
    async stop() {
      stopped = true;
      clearInterval(timer);
      await running;
    },
  };
}

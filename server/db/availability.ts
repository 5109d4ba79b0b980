/**
 * Telling "the database cannot be reached" apart from other errors, so that an outage is answered 503
 * `database_unavailable` (not 500 with a stack trace per request) and logged once until it is reachable again.
 */

/** PostgreSQL SQLSTATEs of a server that is shutting down, starting up or out of connections; Node's network errors. */
const unavailableCodes = new Set(['57P01', '57P02', '57P03', '53300', 'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EPIPE', 'EAI_AGAIN']);
const unavailableMessages = /timeout exceeded when trying to connect|connection terminated|terminating connection due to administrator command|Connection terminated unexpectedly|Client has encountered a connection error|the database system is (starting up|shutting down)/i;

/** True when the error (or one it wraps: Drizzle's query error, an AggregateError) means the database is unreachable. */
export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
  if (depth > 5 || typeof error !== 'object' || error === null) return false;
  const { code, message, cause, errors } = error as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
  if (typeof code === 'string' && (unavailableCodes.has(code) || code.startsWith('08'))) return true;
  if (typeof message === 'string' && unavailableMessages.test(message)) return true;
  if (Array.isArray(errors) && errors.some((inner) => isDatabaseUnavailable(inner, depth + 1))) return true;
  return isDatabaseUnavailable(cause, depth + 1);
}

let outageSince: number | null = null;

/** Logs the first sign of an outage once; later ones stay quiet until the database answers again. */
export function reportDatabaseOutage(error: unknown): void {
  if (outageSince !== null) return;
  outageSince = Date.now();
  const detail = error instanceof Error ? error.message : String(error);
  process.stderr.write(`[db] the database is unreachable (${detail}); answering 503 database_unavailable until it is back\n`);
}

/** Called when a connection succeeds: ends a logged outage. */
export function reportDatabaseReachable(): void {
  if (outageSince === null) return;
  const seconds = Math.round((Date.now() - outageSince) / 1000);
  outageSince = null;
  process.stdout.write(`[db] the database is reachable again (after about ${seconds} s)\n`);
}

/** PostgreSQL error codes the services turn into answers (drizzle wraps the driver's error in `cause`). */
export function pgErrorCode(error: unknown): string | undefined {
  for (let current: unknown = error, depth = 0; current && depth < 5; current = (current as { cause?: unknown }).cause, depth++) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === 'string' && /^[0-9A-Z]{5}$/.test(code)) return code;
  }
  return undefined;
}

export const FOREIGN_KEY_VIOLATION = '23503';

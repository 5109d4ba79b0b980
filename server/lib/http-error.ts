import type { ApiIssue } from '../../shared/contracts/errors';

/** An error with an HTTP status and a stable machine-readable code; the error middleware renders it. */
export class HttpError extends Error {
  override name = 'HttpError';
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: ApiIssue[] = [],
  ) {
    super(message);
  }
}

export const notFound = (what: string, code = 'not_found') => new HttpError(404, code, `${what} was not found`);

/** A 400 naming one field: `invalidField('userId', 'is not a member of this organisation')`. */
export function invalidField(path: string, rule: string): HttpError {
  const message = `${path}: ${rule}`;
  return new HttpError(400, 'invalid_request', message, [{ path, message }]);
}

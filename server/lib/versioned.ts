/** Helpers of the optimistic-concurrency rule that every stored thing follows (a change names the version it read). */
import { HttpError } from './http-error';

/** The fields of a PATCH body that were given (undefined = leave as is; null = clear). */
export function givenFields<T extends object>(fields: T): Partial<T> {
  return Object.fromEntries(Object.entries(fields).filter(([, value]) => value !== undefined)) as Partial<T>;
}

/** 400 when a PATCH names no field to change. */
export function nothingToChange(fields: readonly string[]): HttpError {
  const message = `give at least one of ${fields.join(', ')} to change`;
  return new HttpError(400, 'invalid_request', message.charAt(0).toUpperCase() + message.slice(1), [{ path: '', message }]);
}

/** 409 version_conflict: the thing moved on since the client read it; nothing was changed. */
export function versionConflict(what: string, sent: number, current: number): HttpError {
  return new HttpError(
    409,
    'version_conflict',
    `${what} was changed by someone else (you sent version ${sent}, it is now at version ${current}); reload it and apply your change again`,
    [{ path: 'version', message: `version: is ${current} now, not ${sent}` }],
  );
}

import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { toApiIssues, type ApiErrorBody, type ApiIssue } from '../../shared/contracts/errors';
import { errorCodes } from '../../shared/compute/types';
import { isDatabaseUnavailable, reportDatabaseOutage } from '../db/availability';
import { HttpError } from '../lib/http-error';

export function errorBody(code: string, message: string, issues: ApiIssue[] = []): ApiErrorBody {
  return { error: { code, message, issues } };
}

/** Any /api path that no router answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json(errorBody('not_found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}`));
};

interface BodyParserError {
  type?: string;
  status?: number;
  message: string;
}

function isBodyParserError(error: unknown): error is BodyParserError {
  return typeof error === 'object' && error !== null && 'type' in error && typeof (error as BodyParserError).type === 'string' && 'status' in error;
}

/** The one place that turns errors into `{ error: { code, message, issues } }`. */
export const errorHandler: ErrorRequestHandler = (error: unknown, req, res, next) => {
  if (res.headersSent) {
    next(error);
    return;
  }
  if (error instanceof HttpError) {
    res.status(error.status).json(errorBody(error.code, error.message, error.details));
    return;
  }
  if (error instanceof ZodError) {
    const issues = toApiIssues(error);
    const message = issues.length === 1 ? issues[0].message : `${issues.length} fields are invalid: ${issues.map((i) => i.path || '(body)').join(', ')}`;
    res.status(400).json(errorBody('invalid_request', message, issues));
    return;
  }
  if (error instanceof URIError || (error instanceof Error && (error as { status?: number }).status === 400 && /decode/i.test(error.message))) {
    // A path with broken %-encoding (`/api/projects/%ZZ`): the router cannot decode its parameters.
    res.status(400).json(errorBody('invalid_path', 'The address has broken %-encoding', [{ path: 'path', message: 'path: is not valid %-encoded UTF-8' }]));
    return;
  }
  if (isBodyParserError(error)) {
    if (error.type === 'entity.parse.failed') {
      res.status(400).json(errorBody('invalid_json', 'The request body is not valid JSON', [{ path: '', message: 'the body must be valid JSON' }]));
      return;
    }
    if (error.type === 'entity.too.large') {
      const limit = (error as { limit?: number }).limit;
      res.status(413).json(errorBody('payload_too_large', `The request body is too large${limit ? ` (at most ${Math.round(limit / 1024)} kB here)` : ''}`));
      return;
    }
    if (error.type === 'charset.unsupported' || error.type === 'encoding.unsupported') {
      res.status(415).json(errorBody('unsupported_charset', `The request body could not be read: ${error.message}`));
      return;
    }
    const status = error.status && error.status >= 400 && error.status < 500 ? error.status : 400;
    res.status(status).json(errorBody('invalid_body', `The request body could not be read: ${error.message}`));
    return;
  }
  if (isDatabaseUnavailable(error)) {
    reportDatabaseOutage(error);
    res.status(503).set('Retry-After', '5').json(errorBody('database_unavailable', 'The database cannot be reached right now; try again in a moment'));
    return;
  }
  process.stderr.write(`[api] ${req.method} ${req.originalUrl}: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  res.status(500).json(errorBody(errorCodes.internalError, 'Something went wrong on the server; the error has been logged'));
};

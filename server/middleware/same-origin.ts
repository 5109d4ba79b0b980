import express, { type RequestHandler } from 'express';
import { errorBody } from './error-handler';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests sent from another site: when an Origin header is present it must name this
 * server (the Host the request came to) or APP_URL. Requests without Origin (curl, server-to-server) pass; the
 * session cookie is SameSite=Lax, so browsers do not attach it to cross-site POSTs anyway.
 */
export function sameOrigin(appUrl: string): RequestHandler {
  const appOrigin = new URL(appUrl).origin;
  return (req, res, next) => {
    if (safeMethods.has(req.method)) {
      next();
      return;
    }
    const origin = req.get('origin');
    if (origin === undefined) {
      next();
      return;
    }
    let allowed: boolean;
    try {
      const url = new URL(origin);
      allowed = url.origin === appOrigin || (req.get('host') !== undefined && url.host === req.get('host'));
    } catch {
      allowed = false; // "null" or garbage
    }
    if (allowed) {
      next();
      return;
    }
    res.status(403).json(errorBody('cross_origin', `Requests from ${origin} may not change data here`));
  };
}

/** The one route that takes a file: POST /api/projects/:projectId/site-records (multipart/form-data). */
const multipartRoute = /^\/projects\/[^/]+\/site-records\/?$/;

/**
 * State-changing API routes take JSON: a body of another type is refused before any handler runs. The exception is
 * the upload of a site record, which may be multipart/form-data (mounted under /api, so req.path starts at /projects).
 */
export const requireJsonBody: RequestHandler = (req, res, next) => {
  if (safeMethods.has(req.method) || req.method === 'DELETE') {
    next();
    return;
  }
  if (req.method === 'POST' && multipartRoute.test(req.path) && req.is('multipart/form-data')) {
    next();
    return;
  }
  const hasBody = Number(req.get('content-length') ?? 0) > 0 || req.get('transfer-encoding') !== undefined;
  if (hasBody && !req.is('application/json')) {
    res.status(415).json(errorBody('unsupported_media_type', 'Send the request body as JSON (Content-Type: application/json)'));
    return;
  }
  // JSON is UTF-8 (RFC 8259 §8.1): another charset is refused rather than misread.
  const charset = /;\s*charset\s*=\s*"?([^";\s]+)/i.exec(req.get('content-type') ?? '')?.[1]?.toLowerCase();
  if (hasBody && charset !== undefined && charset !== 'utf-8' && charset !== 'utf8') {
    res.status(415).json(errorBody('unsupported_charset', `Send the JSON body in UTF-8 (charset=utf-8), not ${charset}`));
    return;
  }
  next();
};

/** Parses a JSON body up to `limit` (413 payload_too_large beyond); a body parsed by an earlier mount is kept. */
export function jsonBody(limit: string): RequestHandler {
  return express.json({ limit });
}

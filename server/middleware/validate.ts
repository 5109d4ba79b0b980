import type { RequestHandler } from 'express';
import type { z } from 'zod';

interface Schemas {
  body?: z.ZodType;
  params?: z.ZodType;
  query?: z.ZodType;
}

/**
 * Parses body, params and query with the shared zod schemas and replaces them with the parsed values, so that
 * handlers never parse again. A ZodError goes to the error middleware (400 naming each field).
 */
export function validate(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    if (schemas.params) {
      const params = schemas.params.parse(req.params);
      Object.defineProperty(req, 'params', { value: params, writable: true, configurable: true, enumerable: true });
    }
    if (schemas.query) {
      // Express 5 exposes req.query through a getter: define an own property instead of assigning.
      const query = schemas.query.parse(req.query);
      Object.defineProperty(req, 'query', { value: query, writable: true, configurable: true, enumerable: true });
    }
    if (schemas.body) {
      req.body = schemas.body.parse(req.body ?? {});
    }
    next();
  };
}

/** Types a value that validate() has already parsed with `schema` (no parsing happens here). */
export function parsed<S extends z.ZodType>(_schema: S, value: unknown): z.output<S> {
  return value as z.output<S>;
}

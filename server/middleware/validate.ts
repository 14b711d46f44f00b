import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { invalid } from '../errors/app-error.js';

interface Schemas {
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
  /** What the route answers: not checked at run time, only described in /api/openapi.json. */
  response?: z.ZodType;
}

/** Turns zod issues into `{ "field.path": "message" }`; issues without a path land on `_`. */
export function fieldsOf(error: z.ZodError, prefix?: string): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const path = [prefix, ...issue.path.map(String)].filter(Boolean).join('.') || '_';
    fields[path] ??= issue.message;
  }
  return fields;
}

/**
 * Validates the parts of a request at the edge. The parsed values are kept in `res.locals`
 * (`body`, `query`, `params`) because Express 5 makes `req.query` read-only.
 */
/** The schemas a validate() middleware checks, kept on it for the OpenAPI document. */
export const validatedSchemas = new WeakMap<RequestHandler, Schemas>();

export function validate(schemas: Schemas): RequestHandler {
  const handler: RequestHandler = (req, res, next) => {
    const fields: Record<string, string> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (result.success) res.locals[part] = result.data;
      else Object.assign(fields, fieldsOf(result.error, part === 'body' ? undefined : part));
    }
    if (Object.keys(fields).length > 0) return next(invalid(fields));
    next();
  };
  validatedSchemas.set(handler, schemas);
  return handler;
}

import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { hasUnsafeText } from '../domain/unsafe-text.js';
import { invalid } from '../errors/app-error.js';
import { validatedParts } from '../http/validated-parts.js';

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

/** Field paths of every string in `value` holding a forbidden character. */
export function unsafeTextFields(value: unknown, path: string[] = []): Record<string, string> {
  if (typeof value === 'string') {
    return hasUnsafeText(value) ? { [path.join('.') || '_']: 'Contains a control or direction-override character' } : {};
  }
  if (value === null || typeof value !== 'object') return {};
  return Object.assign(
    {},
    ...Object.entries(value).map(([key, inner]) => unsafeTextFields(inner, [...path, key])),
    // A key may be hostile too.
    ...Object.keys(value)
      .filter((key) => hasUnsafeText(key))
      .map((key) => ({ [[...path, key].join('.')]: 'Contains a control or direction-override character' })),
  );
}

/** The schemas a validate() middleware checks, kept on it for the OpenAPI document. */
export const validatedSchemas = new WeakMap<RequestHandler, Schemas>();

/**
 * Validates the parts of a request at the edge. The parsed values are kept beside the response
 * (Express 5 makes `req.query` read-only) for endpoint() to hand to its handler, typed.
 */
export function validate(schemas: Schemas): RequestHandler {
  const handler: RequestHandler = (req, res, next) => {
    const fields: Record<string, string> = {};
    const parsed: { params?: unknown; query?: unknown; body?: unknown } = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const unsafe = unsafeTextFields(req[part] ?? {}, part === 'body' ? [] : [part]);
      if (Object.keys(unsafe).length > 0) {
        Object.assign(fields, unsafe);
        continue;
      }
      const result = schema.safeParse(req[part] ?? {});
      if (result.success) parsed[part] = result.data;
      else Object.assign(fields, fieldsOf(result.error, part === 'body' ? undefined : part));
    }
    if (Object.keys(fields).length > 0) return next(invalid(fields));
    validatedParts.set(res, parsed);
    next();
  };
  validatedSchemas.set(handler, schemas);
  return handler;
}

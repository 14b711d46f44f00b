import type { Response } from 'express';

/** The parts validate() parsed for a response; kept off `res.locals` so nothing reads them untyped. */
export const validatedParts = new WeakMap<Response, { params?: unknown; query?: unknown; body?: unknown }>();

import type { Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import type { Action } from '../contracts/permissions.js';
import { currentUser, type CurrentUser } from '../auth/current-user.js';
import { requirePermission, requireSignedIn } from '../middleware/require-permission.js';
import { validate } from '../middleware/validate.js';
import { validatedParts } from './validated-parts.js';

type Infer<S> = S extends z.ZodType ? z.output<S> : undefined;

export interface EndpointSpec<P, Q, B> {
  /** The permission-table action the caller needs; 'signed-in' for routes every signed-in user may call. */
  action: Action | 'signed-in';
  params?: P;
  query?: Q;
  body?: B;
  /** What the route answers, described in /api/openapi.json (not checked at run time). */
  response?: z.ZodType;
  /** The status of a successful answer with a body (or a rule from the answer); an answer without one is 204. */
  status?: 200 | 201 | 202 | ((answer: never) => 200 | 201);
  /** Reads multipart bodies (a file under `file`) before validation. */
  before?: RequestHandler[];
}

export interface EndpointInput<P, Q, B> {
  params: Infer<P>;
  query: Infer<Q>;
  body: Infer<B>;
  user: CurrentUser;
  /** For what only HTTP has: an uploaded file, headers. */
  req: Request;
  /** For answers that are not JSON (files); the handler then sends them itself. */
  res: Response;
}

/**
 * One route's handlers, in order: permission, upload parsing, validation of `params`, `query`
 * and `body` with the contract's zod schemas, then the handler with those parts typed. What the
 * handler returns is sent as JSON (`status`, default 200); `undefined` answers 204, unless the
 * handler sent its own answer (a file).
 */
export function endpoint<
  P extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  B extends z.ZodType | undefined = undefined,
>(spec: EndpointSpec<P, Q, B>, handler: (input: EndpointInput<P, Q, B>) => Promise<unknown> | unknown): RequestHandler[] {
  const guard = spec.action === 'signed-in' ? requireSignedIn() : requirePermission(spec.action);
  const checks = validate({ params: spec.params, query: spec.query, body: spec.body, response: spec.response });
  const run: RequestHandler = async (req, res) => {
    const parsed = validatedParts.get(res) ?? {};
    const result = await handler({
      params: parsed.params as Infer<P>,
      query: parsed.query as Infer<Q>,
      body: parsed.body as Infer<B>,
      user: currentUser(res),
      req,
      res,
    });
    if (res.headersSent) return;
    if (result === undefined) res.status(204).end();
    else res.status(typeof spec.status === 'function' ? spec.status(result as never) : (spec.status ?? 200)).json(result);
  };
  return [guard, ...(spec.before ?? []), checks, run];
}

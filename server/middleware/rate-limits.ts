import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError } from '../errors/app-error.js';

const refuse = (message: string) => (_req: unknown, _res: unknown, next: (error: AppError) => void) =>
  next(new AppError(429, 'too_many_requests', message));

/** Starting a sign-in and coming back from the provider: 30 per 5 minutes from one address. Each app counts its own. */
export const signInRateLimit = () =>
  rateLimit({
    windowMs: 5 * 60 * 1000,
    limit: 30,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: refuse('Too many sign-in attempts from this address; wait a few minutes'),
  });

/**
 * Changes: 300 a minute per session (per address before sign-in), far above what a person
 * types and well below what a script could flood the trail with.
 */
export const writeRateLimit = () =>
  rateLimit({
    windowMs: 60 * 1000,
    limit: 300,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skip: (req) => req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS',
    keyGenerator: (req) => (req.session?.userId ? `session:${req.sessionID}` : ipKeyGenerator(req.ip ?? 'unknown')),
    handler: refuse('Too many changes in a minute; wait a moment'),
  });

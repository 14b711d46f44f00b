import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError } from '../errors/app-error.js';
import type { ErrorBody } from '../contracts/errors.js';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `No API route for ${req.method} ${req.originalUrl.split('?')[0]}`));
};

/** The single place where errors become responses: `{ error: { code, message, fields? } }`. */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  let body: ErrorBody;
  let status: number;
  if (error instanceof AppError) {
    status = error.status;
    body = { error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) }, ...error.extra };
  } else if (error?.type === 'entity.parse.failed') {
    status = 400;
    body = { error: { code: 'invalid_json', message: 'The request body is not valid JSON', fields: { _: 'not JSON' } } };
  } else if (error?.code === 'DL409') {
    // The database's lock on what a signed period was compiled from (migration PeriodSignOff).
    status = 409;
    body = { error: { code: 'period_signed', message: `${error.message}. ${error.hint ?? ''}`.trim() } };
  } else if (error?.code === '23P01') {
    // An exclusion constraint: two versions of one limit would apply on the same day.
    status = 409;
    body = {
      error: {
        code: 'conflict',
        message: 'Another version of this limit already applies on those days',
        fields: { appliesFrom: 'Overlaps another version' },
      },
    };
  } else if (error?.code === '23505') {
    // A unique constraint no service named a field for (two requests racing for one number):
    // the transaction rolled back, so nothing was written.
    status = 409;
    body = { error: { code: 'conflict', message: 'A record with these values already exists' } };
  } else if (typeof error?.code === 'string' && error.code.startsWith('22')) {
    // PostgreSQL's data exceptions (a number or date beyond what a column holds) that a contract
    // did not catch first: the transaction rolled back, so nothing was written.
    status = 400;
    body = { error: { code: 'invalid_input', message: 'A value is beyond what can be stored', fields: { _: 'out of range' } } };
    console.warn(`[${req.method} ${req.originalUrl}] data exception ${error.code}: ${error.message}`);
  } else if (error?.type === 'entity.too.large') {
    status = 413;
    body = { error: { code: 'too_large', message: 'The request body is too large' } };
  } else {
    status = 500;
    body = { error: { code: 'internal', message: 'Something went wrong on the server' } };
    console.error(`[${req.method} ${req.originalUrl}]`, error);
  }
  res.status(status).json(body);
};

/** A failure a service expects and the client can act on. The error middleware turns it into JSON. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** More than the error, answered beside it (an import's row report). */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what: string) => new AppError(404, 'not_found', `${what} not found`);
export const forbidden = (message = 'You do not have permission to do this') => new AppError(403, 'forbidden', message);
export const unauthenticated = () => new AppError(401, 'unauthenticated', 'Sign in first');
export const invalid = (fields: Record<string, string>, message = 'Some fields are not valid') =>
  new AppError(400, 'invalid_input', message, fields);
export const conflict = (message: string, fields?: Record<string, string>) => new AppError(409, 'conflict', message, fields);

/** The one error type services throw; the error handler maps it to HTTP once. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export const notFound = (what: string) => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, details?: unknown) => new AppError(409, 'conflict', message, details);
export const badRequest = (message: string, details?: unknown) =>
  new AppError(400, 'validation_failed', message, details);
export const unauthenticated = () =>
  new AppError(401, 'unauthenticated', 'Sign in first: this needs a signed-in user or an access token.');
export const forbidden = (message: string) => new AppError(403, 'forbidden', message);

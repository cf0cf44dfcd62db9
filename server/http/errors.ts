/**
 * Errors that carry an HTTP status and a stable code. Services throw these; the error
 * handler turns them into the one error body.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: { path: string; message: string }[],
  ) {
    super(message)
  }
}

export const badRequest = (code: string, message: string, details?: { path: string; message: string }[]) =>
  new HttpError(400, code, message, details)
export const unauthenticated = () => new HttpError(401, 'unauthenticated', 'Sign in to continue.')
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, 'forbidden', message)
export const notFound = (code = 'not_found', message = 'Not found.') => new HttpError(404, code, message)
export const conflict = (code: string, message: string) => new HttpError(409, code, message)
export const tooManyRequests = (message: string) => new HttpError(429, 'too_many_attempts', message)

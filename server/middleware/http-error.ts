/** An error that already knows its HTTP status and the message the client may see. */
export class HttpError extends Error {
  readonly status: number;
  readonly details?: Record<string, unknown>;

  constructor(status: number, message: string, details?: Record<string, unknown>) {
    super(message);
    this.name = 'HttpError';
    this.status = status;
    this.details = details;
  }
}

export const badRequest = (message: string, details?: Record<string, unknown>) => new HttpError(400, message, details);
export const unauthorized = (message = 'Sign in first.') => new HttpError(401, message);
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, message);
export const notFound = (message = 'Not found.') => new HttpError(404, message);
export const conflict = (message: string, details?: Record<string, unknown>) => new HttpError(409, message, details);

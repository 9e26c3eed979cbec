/** Typed errors with an HTTP status and a stable code; the error middleware renders them as
 * {"error":{"code","message","fields?"}}. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** Extra structured facts for the client (e.g. the row problems of a refused import). */
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) =>
  new AppError(400, 'bad_request', message, fields);
export const unauthenticated = (message = 'Sign in to continue.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your role may not do this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'That record') => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, code = 'conflict') => new AppError(409, code, message);
export const staleVersion = (what: string) =>
  new AppError(409, 'stale_version', `${what} was changed by someone else since you opened it. Reload to see their change; your edit was not saved.`);
export const unprocessable = (message: string, fields?: Record<string, string>, details?: Record<string, unknown>) =>
  new AppError(422, 'unprocessable', message, fields, details);
export const tooManyRequests = (message: string) => new AppError(429, 'too_many_requests', message);
export const unsupportedMedia = (message: string) => new AppError(415, 'unsupported_media_type', message);
export const payloadTooLarge = (message: string) => new AppError(413, 'payload_too_large', message);
export const serviceUnavailable = (message: string) => new AppError(503, 'service_unavailable', message);

/** An API failure as the server described it in {"error":{"code","message","fields?"}}, or a
 * transport failure (status 0) when the server could not be reached at all. Kept free of zod so
 * that the entry chunk can recognise it without loading the contracts. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: Record<string, string>;

  constructor(status: number, code: string, message: string, fields?: Record<string, string>, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** A 4xx means the request itself was refused: asking again gives the same answer. */
export function isClientRefusal(error: unknown): boolean {
  return isApiError(error) && error.status >= 400 && error.status < 500;
}

/** Whether asking again might help: not after a refusal (4xx), nor after an answer whose shape
 * did not match the contract (it would not match the second time either). */
export function isWorthRetrying(error: unknown): boolean {
  if (!isApiError(error)) return true;
  return !isClientRefusal(error) && error.code !== 'unexpected_response';
}

/** What to show a person for any thrown value: the server's own words when there are some. */
export function describeError(error: unknown): string {
  if (isApiError(error)) return error.message;
  return 'Something went wrong in this page. Reload it; if it happens again, tell your office manager.';
}

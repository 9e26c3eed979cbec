import { z } from 'zod';
import { ApiError } from './api-error';

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

export interface ApiRequestOptions {
  method?: Method;
  /** Sent as JSON. */
  body?: unknown;
  signal?: AbortSignal;
}

const errorEnvelope = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});

/**
 * Calls Compline's API on the same origin and parses the answer with the contract passed in.
 * Pass `null` as the contract for endpoints that answer 204 with no body.
 * Every failure becomes an ApiError; this module never shows anything on screen.
 */
export function apiRequest<S extends z.ZodType>(path: string, contract: S, options?: ApiRequestOptions): Promise<z.output<S>>;
export function apiRequest(path: string, contract: null, options?: ApiRequestOptions): Promise<void>;
export async function apiRequest(path: string, contract: z.ZodType | null, options: ApiRequestOptions = {}): Promise<unknown> {
  const { method = 'GET', body, signal } = options;
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
  } catch (err) {
    // An abort is TanStack Query cancelling a request nobody needs any more: let it through as is.
    if (signal?.aborted) throw err;
    throw new ApiError(0, 'network_unreachable', 'Compline could not reach its server. Check your connection and try again.', undefined, {
      cause: err,
    });
  }

  const payload = await readJson(response);
  if (!response.ok) throw toApiError(response, payload);
  if (contract === null) return undefined;

  const parsed = contract.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError(
      response.status,
      'unexpected_response',
      'The server answered in a form this page does not understand. Reload the page; if it happens again, tell your office manager.',
      undefined,
      { cause: parsed.error },
    );
  }
  return parsed.data;
}

async function readJson(response: Response): Promise<unknown> {
  if (response.status === 204) return undefined;
  const type = response.headers.get('content-type') ?? '';
  if (!type.includes('json')) return undefined;
  try {
    return await response.json();
  } catch {
    return undefined;
  }
}

function toApiError(response: Response, payload: unknown): ApiError {
  const envelope = errorEnvelope.safeParse(payload);
  if (envelope.success) {
    const { code, message, fields } = envelope.data.error;
    return new ApiError(response.status, code, message, fields);
  }
  return new ApiError(
    response.status,
    'http_error',
    `The server answered ${response.status}${response.statusText ? ` (${response.statusText})` : ''} without an explanation. Try again in a moment.`,
  );
}

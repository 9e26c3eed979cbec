import { z } from 'zod';
import { ApiError } from './api-error';

/**
 * Multipart uploads with progress. fetch() cannot report how much of a request body has been sent,
 * so uploads go through XMLHttpRequest; the answer is parsed and every failure becomes an ApiError
 * exactly as api-client.ts does for JSON requests. Nothing here shows anything on screen.
 */

export type UploadPhase = 'uploading' | 'processing';

export interface UploadProgress {
  phase: UploadPhase;
  /** Bytes of the request body sent so far and in all (0 when the browser cannot tell). */
  loaded: number;
  total: number;
  /** 0…1 while uploading; 1 once every byte is sent and the server is at work. */
  fraction: number;
}

export interface UploadOptions {
  method?: 'POST' | 'PUT';
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

/** An ApiError that also carries the structured facts of the server's refusal (`error.details`),
 * such as the row problems of a refused import. */
export class UploadError extends ApiError {
  readonly details?: Record<string, unknown>;

  constructor(status: number, code: string, message: string, fields?: Record<string, string>, details?: Record<string, unknown>, options?: { cause?: unknown }) {
    super(status, code, message, fields, options);
    this.name = 'UploadError';
    this.details = details;
  }
}

const errorEnvelope = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    details: z.record(z.string(), z.unknown()).optional(),
  }),
});

function abortError(): DOMException {
  return new DOMException('The upload was cancelled.', 'AbortError');
}

function parseBody(xhr: XMLHttpRequest): unknown {
  const type = xhr.getResponseHeader('content-type') ?? '';
  if (!type.includes('json') || !xhr.responseText) return undefined;
  try {
    return JSON.parse(xhr.responseText) as unknown;
  } catch {
    return undefined;
  }
}

function refusal(xhr: XMLHttpRequest, payload: unknown): UploadError {
  const envelope = errorEnvelope.safeParse(payload);
  if (envelope.success) {
    const { code, message, fields, details } = envelope.data.error;
    return new UploadError(xhr.status, code, message, fields, details);
  }
  return new UploadError(
    xhr.status,
    'http_error',
    `The server answered ${xhr.status}${xhr.statusText ? ` (${xhr.statusText})` : ''} without an explanation. Try again in a moment.`,
  );
}

/** Sends `form` as multipart/form-data to a same-origin API path and parses a 2xx answer with the
 * contract. The browser adds the Origin header and the session cookie itself. */
export function uploadForm<S extends z.ZodType>(path: string, form: FormData, contract: S, options: UploadOptions = {}): Promise<z.output<S>> {
  const { method = 'POST', onProgress, signal } = options;
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(abortError());
    const xhr = new XMLHttpRequest();
    xhr.open(method, path);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');

    const report = (phase: UploadPhase, loaded: number, total: number) =>
      onProgress?.({ phase, loaded, total, fraction: phase === 'processing' ? 1 : total > 0 ? Math.min(1, loaded / total) : 0 });
    xhr.upload.addEventListener('loadstart', () => report('uploading', 0, 0));
    xhr.upload.addEventListener('progress', (event) => report('uploading', event.loaded, event.lengthComputable ? event.total : 0));
    // Every byte is out: from here until the answer, the server is reading and checking the file.
    xhr.upload.addEventListener('load', (event) => report('processing', event.loaded, event.total));

    const onAbort = () => xhr.abort();
    signal?.addEventListener('abort', onAbort, { once: true });
    const settle = () => signal?.removeEventListener('abort', onAbort);

    xhr.addEventListener('load', () => {
      settle();
      const payload = parseBody(xhr);
      if (xhr.status < 200 || xhr.status >= 300) return reject(refusal(xhr, payload));
      const parsed = contract.safeParse(payload);
      if (!parsed.success) {
        return reject(
          new UploadError(
            xhr.status,
            'unexpected_response',
            'The server answered in a form this page does not understand. Reload the page; if it happens again, tell your office manager.',
            undefined,
            undefined,
            { cause: parsed.error },
          ),
        );
      }
      resolve(parsed.data);
    });
    xhr.addEventListener('error', () => {
      settle();
      reject(new UploadError(0, 'network_unreachable', 'The upload did not reach Compline’s server, or the connection dropped. Check your connection and try again.'));
    });
    xhr.addEventListener('abort', () => {
      settle();
      reject(abortError());
    });
    xhr.send(form);
  });
}

export function isAbort(error: unknown): boolean {
  return error instanceof DOMException && error.name === 'AbortError';
}

/** "2.4 MB", "830 KB": file sizes in the binary units the server's limits are set in (60 MB is
 * 60 × 1024 × 1024 bytes), so that a file shown as "60 MB" is one the server takes. */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
  const mb = bytes / (1024 * 1024);
  return `${mb < 10 ? mb.toFixed(1) : Math.round(mb)} MB`;
}

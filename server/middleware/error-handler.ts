import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { MulterError } from 'multer';
import { AppError } from '../errors';
import { fileTooLargeMessage } from '../http/uploads';

const DATABASE_DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', '57P01', '57P02', '57P03', '08000', '08003', '08006', '08001', '08004']);

export function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: string; message?: string; cause?: unknown } | null;
  if (!e) return false;
  if (e.code && DATABASE_DOWN_CODES.has(e.code)) return true;
  if (typeof e.message === 'string' && /Connection terminated|timeout exceeded when trying to connect|connect ECONNREFUSED/i.test(e.message)) return true;
  return e.cause ? isDatabaseUnavailable(e.cause) : false;
}

function zodFields(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** PostgreSQL "data exception" errors (SQLSTATE class 22): a value the request carried that the
 * column cannot hold — an integer beyond 2³¹, a NUL character in text, a date out of range. The
 * statement failed and its transaction rolled back. */
export function isDataException(err: unknown): boolean {
  const code = (err as { code?: unknown } | null)?.code;
  if (typeof code === 'string' && /^22[0-9A-Z]{3}$/.test(code)) return true;
  const cause = (err as { cause?: unknown } | null)?.cause;
  return cause ? isDataException(cause) : false;
}

const MULTER_MESSAGES: Partial<Record<MulterError['code'], [number, string]>> = {
  LIMIT_FILE_COUNT: [413, 'Too many files in one upload.'],
  LIMIT_UNEXPECTED_FILE: [400, 'Unexpected file field.'],
};

/** The one error handler: every API error leaves as {"error":{"code","message","fields?"}} and
 * no stack trace ever reaches the client. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) return;
  const send = (status: number, code: string, message: string, fields?: Record<string, string>, details?: Record<string, unknown>) =>
    res.status(status).json({ error: { code, message, ...(fields && { fields }), ...(details && { details }) } });

  if (err instanceof ZodError) {
    const fields = zodFields(err);
    const first = Object.entries(fields)[0];
    return send(400, 'validation_failed', first ? `Check ${first[0] === '_' ? 'the request' : first[0]}: ${first[1]}` : 'The request is not valid.', fields);
  }
  if (err instanceof AppError) return send(err.status, err.code, err.message, err.fields, err.details);
  if (err instanceof MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') return send(413, 'limit_file_size', fileTooLargeMessage(err.field));
    const [status, message] = MULTER_MESSAGES[err.code] ?? [400, 'The upload was refused.'];
    return send(status, err.code.toLowerCase(), message);
  }
  const e = err as { type?: string; status?: number };
  if (e.type === 'entity.parse.failed') return send(400, 'malformed_json', 'The request body is not valid JSON.');
  if (e.type === 'entity.too.large') return send(413, 'payload_too_large', 'The request body is too large.');
  if (isDataException(err)) {
    // A contract let the value through to the database: worth a line in the log, not a 500.
    console.warn(`400 invalid_value on ${req.method} ${req.originalUrl}: ${(err as Error).message}`);
    return send(400, 'invalid_value', 'A value in the request is out of range or holds a character that cannot be stored (such as a NUL character).');
  }
  if (isDatabaseUnavailable(err)) return send(503, 'database_unavailable', 'The database is not answering. Try again in a moment; nothing was changed.');
  console.error(`500 on ${req.method} ${req.originalUrl}:`, err);
  send(500, 'internal', 'Something went wrong on our side. It has been logged.');
};

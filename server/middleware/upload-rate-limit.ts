import type { RequestHandler } from 'express';
import { tooManyRequests } from '../errors';
import { increment } from '../modules/auth/rate-limit.repo';

/** Photo and CSV uploads each user may start in one window (shared by every app instance: the
 * counter is a row in PostgreSQL, as the sign-in and reset throttles are). A photo request carries
 * up to 20 files, so 60 requests is far beyond what an appraiser does in ten minutes. */
export const UPLOADS_PER_WINDOW = 60;
export const UPLOAD_WINDOW_SECONDS = 10 * 60;

/** Goes after the route's guard (it counts per signed-in user) and before multer, so that a
 * refused upload is turned away before a byte of its file is written to disk. */
export const uploadRateLimit: RequestHandler = async (req, res, next) => {
  if (!req.auth) return next();
  const count = await increment(`upload:user:${req.auth.user.id}`, UPLOAD_WINDOW_SECONDS);
  if (count <= UPLOADS_PER_WINDOW) return next();
  res.set('Retry-After', String(UPLOAD_WINDOW_SECONDS));
  // The body was not read: close the connection after the answer rather than drain a large file.
  res.set('Connection', 'close');
  next(tooManyRequests(`More than ${UPLOADS_PER_WINDOW} uploads in ten minutes. Wait a few minutes and try again.`));
};

import type { SessionUser } from '../contracts/auth';

declare global {
  namespace Express {
    interface Request {
      /** Set by the session middleware when a valid session cookie came with the request. */
      auth?: { user: SessionUser; sessionId: string };
    }
  }
}
export {};

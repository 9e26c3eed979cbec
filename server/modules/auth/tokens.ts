import { createHash, randomBytes } from 'node:crypto';

/** A single-use token for e-mailed links: the link carries the token, the database only its SHA-256. */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

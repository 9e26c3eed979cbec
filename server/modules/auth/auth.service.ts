import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import { db } from '../../../db/client';
import { invitations, passwordResets } from '../../../db/schema/auth';
import { organisations, users } from '../../../db/schema/organisations';
import { env } from '../../env';
import { AppError, badRequest, conflict, tooManyRequests } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { audit } from '../audit/audit.service';
import { findUserByEmail } from '../users/users.repo';
import { lucia } from './lucia';
import { hashPassword, verifyPassword } from './password';
import { decrement, increment, reset } from './rate-limit.repo';
import { hashToken, newLinkToken } from './tokens';

const SIGN_IN_WINDOW_SECONDS = 15 * 60;
const RESET_WINDOW_SECONDS = 60 * 60;
const RESET_MAX_PER_EMAIL = 3;
const RESET_MAX_PER_IP = 20;

const wrongCredentials = () =>
  new AppError(401, 'wrong_credentials', 'That e-mail address and password do not match an active account.');

/** Checks the password, throttling repeated failures per e-mail address and per client address,
 * and opens a new session (a fresh id at every sign-in: the old one, if any, is dropped). */
export async function signIn(input: { email: string; password: string; ip: string; previousSessionId: string | null }) {
  const emailKey = `sign-in:email:${input.email}`;
  const ipKey = `sign-in:ip:${input.ip}`;
  // Count the attempt before checking the password, in one atomic step: parallel guesses cannot
  // all read a count that none of them has raised yet.
  const [emailAttempts, ipAttempts] = await Promise.all([increment(emailKey, SIGN_IN_WINDOW_SECONDS), increment(ipKey, SIGN_IN_WINDOW_SECONDS)]);
  if (emailAttempts > env.SIGN_IN_MAX_FAILURES || ipAttempts > env.SIGN_IN_MAX_FAILURES * 10) {
    throw tooManyRequests('Too many failed sign-ins. Wait 15 minutes, or reset your password by e-mail.');
  }
  const user = await findUserByEmail(input.email);
  const passwordOk = await verifyPassword(user?.passwordHash ?? null, input.password);
  if (!user || !passwordOk || !user.active) throw wrongCredentials();
  // A success clears the account's count and gives back this attempt to the address.
  await Promise.all([reset(emailKey), decrement(ipKey)]);
  if (input.previousSessionId) await lucia.invalidateSession(input.previousSessionId);
  const session = await lucia.createSession(user.id, {});
  await audit(db, { actorUserId: user.id, organisationId: user.organisationId, action: 'sign-in', entityType: 'user', entityId: user.id });
  return { session, cookie: lucia.createSessionCookie(session.id) };
}

export async function signOut(sessionId: string) {
  await lucia.invalidateSession(sessionId);
  return lucia.createBlankSessionCookie();
}

/** Always answers the same way, whether or not the address has an account. */
export async function requestPasswordReset(email: string, ip: string, appOrigin: string): Promise<void> {
  const [byEmail, byIp] = await Promise.all([
    increment(`reset:email:${email}`, RESET_WINDOW_SECONDS),
    increment(`reset:ip:${ip}`, RESET_WINDOW_SECONDS),
  ]);
  if (byEmail > RESET_MAX_PER_EMAIL || byIp > RESET_MAX_PER_IP) {
    throw tooManyRequests('Too many reset requests. Try again in an hour.');
  }
  const user = await findUserByEmail(email);
  if (!user || !user.active) return;
  const { token, tokenHash } = newLinkToken();
  await db.transaction(async (tx) => {
    await tx.insert(passwordResets).values({ tokenHash, userId: user.id, expiresAt: sql`now() + interval '1 hour'` });
    await enqueueMail(tx, {
      to: user.email,
      subject: 'Reset your Compline password',
      text: `Someone asked to reset the password of your Compline account.\n\nTo choose a new password, open this link within an hour:\n${appOrigin}/reset-password?token=${token}\n\nIf it was not you, ignore this message: your password stays as it is.`,
    });
    await audit(tx, { actorUserId: null, organisationId: user.organisationId, action: 'password-reset-requested', entityType: 'user', entityId: user.id });
  });
}

export async function confirmPasswordReset(token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  const userId = await db.transaction(async (tx) => {
    const [row] = await tx
      .update(passwordResets)
      .set({ usedAt: sql`now()` })
      .where(and(eq(passwordResets.tokenHash, hashToken(token)), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, sql`now()`)))
      .returning();
    if (!row) throw badRequest('This reset link is not valid any more. Ask for a new one.', { token: 'Expired or already used.' });
    await tx.update(users).set({ passwordHash, version: sql`${users.version} + 1` }).where(eq(users.id, row.userId));
    // Any other reset link still open for this account dies with this one.
    await tx.update(passwordResets).set({ usedAt: sql`now()` }).where(and(eq(passwordResets.userId, row.userId), isNull(passwordResets.usedAt)));
    await audit(tx, { actorUserId: row.userId, action: 'password-changed', entityType: 'user', entityId: row.userId });
    return row.userId;
  });
  // A changed password ends every open session of the account.
  await lucia.invalidateUserSessions(userId);
}

async function openInvitation(token: string) {
  const [row] = await db
    .select({ invitation: invitations, organisationName: organisations.name })
    .from(invitations)
    .innerJoin(organisations, eq(organisations.id, invitations.organisationId))
    .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, sql`now()`)));
  if (!row) throw badRequest('This invitation is not valid any more. Ask your office manager for a new one.', { token: 'Expired or already used.' });
  return row;
}

export async function previewInvitation(token: string) {
  const { invitation, organisationName } = await openInvitation(token);
  return { email: invitation.email, name: invitation.name, role: invitation.role, organisationName };
}

export async function acceptInvitation(token: string, password: string) {
  const { invitation } = await openInvitation(token);
  const passwordHash = await hashPassword(password);
  const user = await db.transaction(async (tx) => {
    const [claimed] = await tx
      .update(invitations)
      .set({ acceptedAt: sql`now()` })
      .where(and(eq(invitations.id, invitation.id), isNull(invitations.acceptedAt)))
      .returning();
    if (!claimed) throw conflict('This invitation was already used.');
    const [created] = await tx
      .insert(users)
      .values({ email: invitation.email, name: invitation.name, role: invitation.role, organisationId: invitation.organisationId, passwordHash })
      .onConflictDoNothing()
      .returning();
    if (!created) throw conflict('An account with this e-mail address already exists.', 'email_taken');
    await audit(tx, { actorUserId: created.id, organisationId: created.organisationId, action: 'invitation-accepted', entityType: 'user', entityId: created.id });
    return created;
  });
  const session = await lucia.createSession(user.id, {});
  return lucia.createSessionCookie(session.id);
}

import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../../../db/client';
import { invitations } from '../../../db/schema/auth';
import { users } from '../../../db/schema/organisations';
import type { SessionUser } from '../../contracts/auth';
import { roleLabels } from '../../contracts/auth';
import type { inviteRequest, updateUserRequest } from '../../contracts/users';
import { badRequest, notFound, staleVersion, unprocessable } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { audit } from '../audit/audit.service';
import { lucia } from '../auth/lucia';
import { newLinkToken } from '../auth/tokens';
import { findOrganisation, findUser, findUserByEmail } from './users.repo';

/** Lender clients belong to a lender organisation; everyone else to the firm. */
function checkRoleFitsOrganisation(role: SessionUser['role'], kind: 'firm' | 'lender') {
  const wanted = role === 'client' ? 'lender' : 'firm';
  if (kind !== wanted) {
    throw unprocessable(`A ${roleLabels[role].toLowerCase()} must belong to ${wanted === 'lender' ? 'a lender' : 'the appraisal firm'}.`, {
      organisationId: 'Does not fit the role.',
    });
  }
}

export async function invite(actor: SessionUser, input: z.infer<typeof inviteRequest>, appOrigin: string) {
  const organisation = await findOrganisation(db, input.organisationId);
  if (!organisation) throw badRequest('Pick an organisation.', { organisationId: 'No such organisation.' });
  checkRoleFitsOrganisation(input.role, organisation.kind);
  if (await findUserByEmail(input.email)) {
    throw unprocessable('Someone already has an account with that e-mail address.', { email: 'Already has an account.' });
  }
  const { token, tokenHash } = newLinkToken();
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(invitations)
      .values({ ...input, tokenHash, invitedBy: actor.id, expiresAt: sql`now() + interval '7 days'` })
      .returning({ id: invitations.id });
    await enqueueMail(tx, {
      to: input.email,
      subject: `${actor.name} invited you to Compline`,
      text: `${actor.name} invited you to Compline as ${roleLabels[input.role].toLowerCase()} for ${organisation.name}.\n\nChoose your password within 7 days:\n${appOrigin}/invitation?token=${token}`,
    });
    await audit(tx, { actorUserId: actor.id, organisationId: actor.organisationId, action: 'user-invited', entityType: 'invitation', entityId: row.id, details: { email: input.email, role: input.role } });
    return { id: row.id };
  });
}

export async function updateUser(actor: SessionUser, userId: number, input: z.infer<typeof updateUserRequest>) {
  const result = await db.transaction(async (tx) => {
    const current = await findUser(tx, userId);
    if (!current) throw notFound('That user');
    if (input.role) {
      const organisation = await findOrganisation(tx, current.organisationId);
      checkRoleFitsOrganisation(input.role, organisation!.kind);
    }
    if (userId === actor.id && (input.active === false || (input.role && input.role !== 'admin'))) {
      throw unprocessable('You cannot deactivate yourself or give up your own admin role.');
    }
    const [updated] = await tx
      .update(users)
      .set({ role: input.role ?? current.role, active: input.active ?? current.active, version: sql`${users.version} + 1` })
      .where(and(eq(users.id, userId), eq(users.version, input.version)))
      .returning({ id: users.id, active: users.active, role: users.role, version: users.version });
    if (!updated) throw staleVersion('This user');
    await audit(tx, {
      actorUserId: actor.id,
      organisationId: actor.organisationId,
      action: 'user-updated',
      entityType: 'user',
      entityId: userId,
      details: { from: { role: current.role, active: current.active }, to: { role: updated.role, active: updated.active } },
    });
    return updated;
  });
  if (!result.active) await lucia.invalidateUserSessions(userId);
  return result;
}

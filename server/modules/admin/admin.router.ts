import { Router } from 'express';
import { desc, eq } from 'drizzle-orm';
import { db } from '../../../db/client';
import { auditEvents } from '../../../db/schema/audit';
import { outboxMessages } from '../../../db/schema/mail';
import { users } from '../../../db/schema/organisations';
import { allow } from '../../http/access';

/** The office manager's views: every e-mail the system sent (or is retrying) and the audit trail. */
export const adminRouter = Router();

adminRouter.get('/outbox', allow('admin'), async (_req, res) => {
  const messages = await db.select().from(outboxMessages).orderBy(desc(outboxMessages.id)).limit(200);
  res.json({ messages });
});

adminRouter.get('/audit', allow('admin'), async (_req, res) => {
  const events = await db
    .select({
      id: auditEvents.id,
      at: auditEvents.at,
      actorName: users.name,
      action: auditEvents.action,
      entityType: auditEvents.entityType,
      entityId: auditEvents.entityId,
      details: auditEvents.details,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .orderBy(desc(auditEvents.id))
    .limit(300);
  res.json({ events });
});

import { eq } from 'drizzle-orm';
import type { Db } from '../client';
import { organisations, users } from '../schema/organisations';
import { hashPassword } from '../../server/modules/auth/password';
import { DEMO_PASSWORD, demoOrganisations, demoUsers } from './demo-accounts';
import { seedDemoAssignment } from './seed-assignment';
import { seedDemoFees } from './seed-fees';
import { seedDemoReviewAssignment } from './seed-review-assignment';

/** Seeds the Port Ellery demo. Idempotent: rows are matched by natural keys (organisation name,
 * e-mail), so a second run adds nothing and never touches what users added or changed. */
export async function seedDemo(db: Db): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.insert(organisations).values(demoOrganisations).onConflictDoNothing();
    const orgs = await tx.select().from(organisations);
    const orgId = (name: string) => orgs.find((o) => o.name === name)!.id;
    for (const u of demoUsers) {
      const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, u.email));
      if (existing) continue;
      await tx.insert(users).values({
        email: u.email,
        name: u.name,
        role: u.role,
        organisationId: orgId(u.organisation),
        licenceNumber: u.licenceNumber,
        passwordHash: await hashPassword(DEMO_PASSWORD),
      });
    }
  });
  await seedDemoAssignment(db);
  await seedDemoReviewAssignment(db);
  await seedDemoFees(db);
}

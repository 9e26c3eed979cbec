import { asc, eq } from 'drizzle-orm';
import { db, type DbOrTx } from '../../../db/client';
import { organisations, users } from '../../../db/schema/organisations';

const sessionUserColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  organisationId: users.organisationId,
  organisationName: organisations.name,
  organisationKind: organisations.kind,
};

export async function findUserByEmail(email: string) {
  const [row] = await db.select().from(users).where(eq(users.email, email.toLowerCase()));
  return row;
}

export async function listUsers() {
  return db
    .select({ ...sessionUserColumns, active: users.active, version: users.version, createdAt: users.createdAt })
    .from(users)
    .innerJoin(organisations, eq(organisations.id, users.organisationId))
    .orderBy(asc(organisations.name), asc(users.name));
}

export async function findUser(tx: DbOrTx, id: number) {
  const [row] = await tx.select().from(users).where(eq(users.id, id));
  return row;
}

export async function listOrganisations() {
  return db.select().from(organisations).orderBy(asc(organisations.kind), asc(organisations.name));
}

export async function findOrganisation(tx: DbOrTx, id: number) {
  const [row] = await tx.select().from(organisations).where(eq(organisations.id, id));
  return row;
}

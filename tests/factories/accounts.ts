import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { organisations, users } from '../../db/schema/organisations';
import { hashPassword } from '../../server/modules/auth/password';
import type { Role } from '../../server/contracts/auth';

/** Organisations and users written straight through Drizzle, each with unique names and e-mails so
 * that no test sees another's rows. Every user gets a known password. */

let sequence = 0;

/** A suffix no other call in this run (nor, with the random part, in another file) returns. */
export function uniqueSuffix(): string {
  sequence += 1;
  return `${sequence}-${randomBytes(4).toString('hex')}`;
}

export function uniqueEmail(label = 'person'): string {
  return `${label}-${uniqueSuffix()}@factory.example`;
}

export type OrganisationKind = 'firm' | 'lender';
export type TestOrganisation = typeof organisations.$inferSelect;

export async function createOrganisation(kind: OrganisationKind, name?: string): Promise<TestOrganisation> {
  const label = kind === 'firm' ? 'Test Valuation Firm' : 'Test Lender';
  const [row] = await db
    .insert(organisations)
    .values({ name: name ?? `${label} ${uniqueSuffix()}`, kind })
    .returning();
  return row;
}

export interface TestUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  password: string;
  active: boolean;
  version: number;
  organisation: TestOrganisation;
}

export interface UserOptions {
  role: Role;
  /** Defaults to a new lender for a client and a new firm for every other role. */
  organisation?: TestOrganisation;
  password?: string;
  email?: string;
  name?: string;
  active?: boolean;
}

export async function createUser(options: UserOptions): Promise<TestUser> {
  const organisation = options.organisation ?? (await createOrganisation(options.role === 'client' ? 'lender' : 'firm'));
  const password = options.password ?? `known-password-${uniqueSuffix()}`;
  const email = (options.email ?? uniqueEmail(options.role)).toLowerCase();
  const [row] = await db
    .insert(users)
    .values({
      email,
      name: options.name ?? `Test ${options.role} ${uniqueSuffix()}`,
      role: options.role,
      organisationId: organisation.id,
      passwordHash: await hashPassword(password),
      active: options.active ?? true,
    })
    .returning();
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    password,
    active: row.active,
    version: row.version,
    organisation,
  };
}

/** The user's row as it stands now (to check what a request did or did not change). */
export async function reloadUser(id: number) {
  const [row] = await db.select().from(users).where(eq(users.id, id));
  return row;
}

export async function usersWithEmail(email: string) {
  return db.select().from(users).where(eq(users.email, email.toLowerCase()));
}

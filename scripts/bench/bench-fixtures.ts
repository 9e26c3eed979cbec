import { readFileSync } from 'node:fs';
import supertest from 'supertest';
import { db } from '../../db/client';
import { assignments, sales, subjects } from '../../db/schema/assignments';
import { organisations, users } from '../../db/schema/organisations';
import { hashPassword } from '../../server/modules/auth/password';

/** A firm, an appraiser with a known password and a lender, for one benchmark run. */
export async function benchFirm(label: string) {
  const stamp = `${label}-${Date.now()}`;
  const [firm] = await db.insert(organisations).values({ name: `Bench firm ${stamp}`, kind: 'firm' }).returning();
  const [lender] = await db.insert(organisations).values({ name: `Bench lender ${stamp}`, kind: 'lender' }).returning();
  const password = `bench-password-${stamp}`;
  const [appraiser] = await db
    .insert(users)
    .values({ email: `bench-${stamp}@bench.example`, name: 'Bench Appraiser', role: 'appraiser', organisationId: firm.id, passwordHash: await hashPassword(password) })
    .returning();
  return { firm, lender, appraiser: { ...appraiser, password } };
}

export async function benchAssignment(firm: { firm: { id: number }; lender: { id: number }; appraiser: { id: number } }, saleCount = 0) {
  const [a] = await db
    .insert(assignments)
    .values({ firmOrganisationId: firm.firm.id, clientOrganisationId: firm.lender.id, appraiserUserId: firm.appraiser.id, subjectAddress: `${Date.now()} Bench Lane`, intendedUse: 'Benchmark', effectiveDate: '2026-11-15' })
    .returning();
  await db.insert(subjects).values({ assignmentId: a.id, floorArea: 1850, neighbourhood: 'N0' });
  for (let start = 0; start < saleCount; start += 1000) {
    const batch = Array.from({ length: Math.min(1000, saleCount - start) }, (_, k) => {
      const i = start + k;
      const area = 900 + ((i * 7919) % 2200);
      return { assignmentId: a.id, address: `${i + 1} Bench Street`, neighbourhood: `N${i % 8}`, salePrice: 40_000 + 180 * area + ((i * 104729) % 40_000), saleDate: `2026-0${1 + (i % 9)}-1${i % 10}`, floorArea: area };
    });
    await db.insert(sales).values(batch);
  }
  return a;
}

export async function signInCookie(origin: string, user: { email: string; password: string }): Promise<string> {
  const res = await supertest(origin).post('/api/auth/sign-in').set('Origin', origin).send({ email: user.email, password: user.password });
  if (res.status !== 204) throw new Error(`sign-in failed: ${res.status} ${res.text}`);
  return res.headers['set-cookie'][0].split(';')[0];
}

/** Resident set size of a process, from /proc (Linux). */
export function rssMiB(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+)/.exec(status)![1]) / 1024;
}

import path from 'node:path';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import type { Db } from './client';

/** Applies the committed drizzle-kit migrations (idempotent; tens of milliseconds when current). */
export async function applyMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder: path.resolve(import.meta.dirname, 'migrations') });
}

import pg from 'pg';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { env } from '../server/env';
import * as organisations from './schema/organisations';
import * as auth from './schema/auth';
import * as audit from './schema/audit';
import * as mail from './schema/mail';
import * as assignments from './schema/assignments';
import * as review from './schema/review';
import * as delivery from './schema/delivery';

export const schema = { ...organisations, ...auth, ...audit, ...mail, ...assignments, ...review, ...delivery };

export const pool = new pg.Pool({
  connectionString: env.DATABASE_URL,
  max: 20,
  connectionTimeoutMillis: 3000,
  idleTimeoutMillis: 30_000,
});
// A dropped connection (database restarted) must not crash the process; the pool reconnects.
pool.on('error', (err) => console.error('database pool error:', err.message));

export const db = drizzle(pool, { schema });
export type Db = NodePgDatabase<typeof schema>;
/** A transaction handle or the database itself: repos accept either. */
export type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

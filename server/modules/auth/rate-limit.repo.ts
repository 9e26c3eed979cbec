import { sql } from 'drizzle-orm';
import { db } from '../../../db/client';

/** Fixed-window counters in PostgreSQL (shared by every app instance). */
export async function currentCount(key: string, windowSeconds: number): Promise<number> {
  const { rows } = await db.execute<{ count: number }>(sql`
    select count from rate_limits
    where key = ${key} and window_started_at > now() - make_interval(secs => ${windowSeconds})`);
  return rows[0]?.count ?? 0;
}

export async function increment(key: string, windowSeconds: number): Promise<number> {
  const { rows } = await db.execute<{ count: number }>(sql`
    insert into rate_limits (key, count, window_started_at) values (${key}, 1, now())
    on conflict (key) do update set
      count = case when rate_limits.window_started_at <= now() - make_interval(secs => ${windowSeconds})
                   then 1 else rate_limits.count + 1 end,
      window_started_at = case when rate_limits.window_started_at <= now() - make_interval(secs => ${windowSeconds})
                   then now() else rate_limits.window_started_at end
    returning count`);
  return rows[0].count;
}

export async function decrement(key: string): Promise<void> {
  await db.execute(sql`update rate_limits set count = greatest(count - 1, 0) where key = ${key}`);
}

export async function reset(key: string): Promise<void> {
  await db.execute(sql`delete from rate_limits where key = ${key}`);
}

// Checks with EXPLAIN that the hot queries use their indexes on a large table (run after the import
// benchmark has written 250,000 sales). Prints each plan's top node.
import { sql } from 'drizzle-orm';
import { db, pool } from '../../db/client';
import { recordFigures } from './report';

await db.execute(sql`analyze`);
const [{ id }] = (await db.execute<{ id: number }>(sql`select assignment_id as id from sales group by assignment_id order by count(*) desc limit 1`)).rows;
const queries: Array<[string, ReturnType<typeof sql>]> = [
  ['sales of one assignment', sql`select * from sales where assignment_id = ${id} and deleted_at is null`],
  ['photos of one assignment', sql`select * from photos where assignment_id = ${id} and deleted_at is null`],
  ['assignments of a firm', sql`select * from assignments where firm_organisation_id = 1 and archived_at is null`],
  ['open queries of an assignment', sql`select count(*) from review_queries where assignment_id = ${id} and status <> 'resolved'`],
  ['due e-mails', sql`select id from outbox_messages where status = 'queued' and next_attempt_at <= now() order by id limit 100`],
  ['report by fingerprint', sql`select id from report_versions where sha256 = 'x'`],
];
const rows: Array<[string, string]> = [];
for (const [name, query] of queries) {
  const plan = (await db.execute<{ 'QUERY PLAN': string }>(sql`explain ${query}`)).rows.map((r) => r['QUERY PLAN']);
  const uses = plan.find((l) => /Index|Bitmap/.test(l)) ?? plan[0];
  console.log(`${name}: ${uses.trim()}`);
  rows.push([name, uses.trim().replace(/\|/g, '/')]);
}
await pool.end();
recordFigures('explain', rows);

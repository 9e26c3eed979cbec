import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../../../db/client';
import type { SaleFields } from '../../contracts/sales';

/** Rows per statement: each statement sends one array per column, not one parameter per value. */
const CHUNK = 10_000;

const columns: ReadonlyArray<readonly [string, string, (s: SaleFields) => unknown]> = [
  ['address', 'text', (s: SaleFields) => s.address],
  ['lon', 'float8', (s: SaleFields) => s.lon],
  ['lat', 'float8', (s: SaleFields) => s.lat],
  ['neighbourhood', 'text', (s: SaleFields) => s.neighbourhood],
  ['sale_price', 'float8', (s: SaleFields) => s.salePrice],
  ['sale_date', 'date', (s: SaleFields) => s.saleDate],
  ['floor_area', 'float8', (s: SaleFields) => s.floorArea],
  ['lot_size', 'float8', (s: SaleFields) => s.lotSize],
  ['bedrooms', 'int4', (s: SaleFields) => s.bedrooms],
  ['bathrooms', 'float8', (s: SaleFields) => s.bathrooms],
  ['year_built', 'int4', (s: SaleFields) => s.yearBuilt],
  ['condition', 'int4', (s: SaleFields) => s.condition],
  ['quality', 'int4', (s: SaleFields) => s.quality],
  ['garage_spaces', 'int4', (s: SaleFields) => s.garageSpaces],
  ['sale_type', 'sale_type', (s: SaleFields) => s.saleType],
  ['seller_concessions', 'float8', (s: SaleFields) => s.sellerConcessions],
  ['data_source', 'text', (s: SaleFields) => s.dataSource],
  ['verification_note', 'text', (s: SaleFields) => s.verificationNote],
];

/** Inserts many sales with INSERT … SELECT FROM unnest(arrays): a few statements for tens of
 * thousands of rows, inside the caller's transaction. */
export async function insertSalesBulk(tx: DbOrTx, assignmentId: number, importId: number, rows: readonly SaleFields[]): Promise<void> {
  for (let start = 0; start < rows.length; start += CHUNK) {
    const chunk = rows.slice(start, start + CHUNK);
    const arrays = columns.map(([, type, pick]) => sql`${sql.param(chunk.map(pick))}::${sql.raw(type)}[]`);
    await tx.execute(sql`
      insert into sales (assignment_id, import_id, ${sql.raw(columns.map(([name]) => name).join(', '))})
      select ${assignmentId}, ${importId}, u.* from unnest(${sql.join(arrays, sql`, `)}) as u`);
  }
}

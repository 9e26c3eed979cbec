import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../../db/client';
import { photos, sales } from '../../../db/schema/assignments';

const photoCount = sql<number>`(select count(*)::int from ${photos} where ${photos.saleId} = ${sales.id} and ${photos.deletedAt} is null)`;

const saleColumns = {
  id: sales.id,
  assignmentId: sales.assignmentId,
  address: sales.address,
  lon: sales.lon,
  lat: sales.lat,
  neighbourhood: sales.neighbourhood,
  salePrice: sales.salePrice,
  saleDate: sales.saleDate,
  floorArea: sales.floorArea,
  lotSize: sales.lotSize,
  bedrooms: sales.bedrooms,
  bathrooms: sales.bathrooms,
  yearBuilt: sales.yearBuilt,
  condition: sales.condition,
  quality: sales.quality,
  garageSpaces: sales.garageSpaces,
  saleType: sales.saleType,
  sellerConcessions: sales.sellerConcessions,
  dataSource: sales.dataSource,
  verificationNote: sales.verificationNote,
  inGrid: sales.inGrid,
  excluded: sales.excluded,
  exclusionReason: sales.exclusionReason,
  coverPhotoId: sales.coverPhotoId,
  version: sales.version,
  updatedAt: sales.updatedAt,
};

/** Every live sale of an assignment with its photo count, in one query. */
export async function listSales(tx: DbOrTx, assignmentId: number) {
  return tx
    .select({ ...saleColumns, photoCount })
    .from(sales)
    .where(and(eq(sales.assignmentId, assignmentId), isNull(sales.deletedAt)))
    .orderBy(asc(sales.id));
}

export async function findSale(tx: DbOrTx, assignmentId: number, saleId: number) {
  const [row] = await tx
    .select({ ...saleColumns, photoCount })
    .from(sales)
    .where(and(eq(sales.id, saleId), eq(sales.assignmentId, assignmentId), isNull(sales.deletedAt)));
  return row;
}

export type SaleRow = Awaited<ReturnType<typeof listSales>>[number];

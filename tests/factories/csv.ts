/** CSV exports of sales as an appraiser might download them from a records system, built in memory.
 * Every address is invented (streets of the demo town of Port Ellery, which does not exist). */

export interface SaleCsvRow {
  address: string;
  price: string;
  date: string;
  area: string;
  lon: string;
  lat: string;
  beds: string;
  baths: string;
}

export type SaleCsvColumn = keyof SaleCsvRow;

/** Column headers as a typical export names them. */
export const standardHeaders: Record<SaleCsvColumn, string> = {
  address: 'Property Address',
  price: 'Sale Price',
  date: 'Sale Date',
  area: 'GLA',
  lon: 'Longitude',
  lat: 'Latitude',
  beds: 'Beds',
  baths: 'Baths',
};

/** Headers no synonym list would recognise: only a saved mapping can map them. */
export const oddHeaders: Record<SaleCsvColumn, string> = {
  address: 'Where',
  price: 'Paid',
  date: 'Deed Filed',
  area: 'Heated Space',
  lon: 'E-W',
  lat: 'N-S',
  beds: 'Sleeping Rooms',
  baths: 'Wet Rooms',
};

const STREETS = ['Mooring Way', 'Ropewalk Lane', 'Cooper Street', 'Netmender Road', 'Tidewater Court', 'Beacon Row'];

/** A plausible closed sale, the same for the same index: the index keeps addresses unique in a file. */
export function cleanSaleRow(index: number, overrides: Partial<SaleCsvRow> = {}): SaleCsvRow {
  const day = new Date(Date.UTC(2024, 0, 1) + (index % 600) * 86_400_000).toISOString().slice(0, 10);
  const area = 1_100 + ((index * 37) % 1_400);
  return {
    address: `${index + 1} ${STREETS[index % STREETS.length]}`,
    price: String(180_000 + area * 190 + ((index * 7_919) % 40_000)),
    date: day,
    area: String(area),
    lon: (-61.418 + ((index * 13) % 100) * 0.00035).toFixed(6),
    lat: (44.697 + ((index * 29) % 100) * 0.00014).toFixed(6),
    beds: String(2 + (index % 4)),
    baths: String(1 + (index % 3) * 0.5),
    ...overrides,
  };
}

export function cleanSaleRows(count: number, firstIndex = 0): SaleCsvRow[] {
  return Array.from({ length: count }, (_, i) => cleanSaleRow(firstIndex + i));
}

function quote(cell: string): string {
  return /[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell;
}

/** The file's text: a header line, then one line per row, CRLF as spreadsheets write it. */
export function salesCsv(rows: readonly SaleCsvRow[], headers: Record<SaleCsvColumn, string> = standardHeaders): string {
  const columns = Object.keys(headers) as SaleCsvColumn[];
  const lines = [columns.map((c) => quote(headers[c])), ...rows.map((row) => columns.map((c) => quote(row[c])))];
  return `${lines.map((cells) => cells.join(',')).join('\r\n')}\r\n`;
}

export function csvFile(rows: readonly SaleCsvRow[], headers: Record<SaleCsvColumn, string> = standardHeaders): Buffer {
  return Buffer.from(salesCsv(rows, headers), 'utf8');
}

/** The mapping a user would pick for a file with the given headers (field → header). */
export function mappingFor(headers: Record<SaleCsvColumn, string>) {
  return {
    address: headers.address,
    salePrice: headers.price,
    saleDate: headers.date,
    floorArea: headers.area,
    lon: headers.lon,
    lat: headers.lat,
    bedrooms: headers.beds,
    bathrooms: headers.baths,
  };
}

/** A date `days` after today (UTC), for sales that have not closed yet. */
export function daysFromToday(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

import { importFields } from '../../contracts/sales-import';
import type { SaleRow } from './sales.repo';

/** A cell a spreadsheet would run as a formula starts with one of these (OWASP's list, plus the
 * full-width forms some spreadsheets also accept). */
const FORMULA_START = /^[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/;

/** Text that a spreadsheet shows as text: a formula-like cell gets a leading single quote, and a
 * cell with a comma, quote or line break is quoted (RFC 4180). Numbers are ours and stay numbers. */
export function csvCell(value: string | number | boolean | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  const text = FORMULA_START.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

type Column = readonly [string, (s: SaleRow) => string | number | boolean | null];

// Headers are the import's own labels, so an exported file maps itself when imported again.
const columns: readonly Column[] = [
  [importFields.address.label, (s) => s.address],
  [importFields.salePrice.label, (s) => s.salePrice],
  [importFields.saleDate.label, (s) => s.saleDate],
  [importFields.floorArea.label, (s) => s.floorArea],
  [importFields.lon.label, (s) => s.lon],
  [importFields.lat.label, (s) => s.lat],
  [importFields.neighbourhood.label, (s) => s.neighbourhood],
  [importFields.lotSize.label, (s) => s.lotSize],
  [importFields.bedrooms.label, (s) => s.bedrooms],
  [importFields.bathrooms.label, (s) => s.bathrooms],
  [importFields.yearBuilt.label, (s) => s.yearBuilt],
  [importFields.condition.label, (s) => s.condition],
  [importFields.quality.label, (s) => s.quality],
  [importFields.garageSpaces.label, (s) => s.garageSpaces],
  [importFields.saleType.label, (s) => s.saleType],
  [importFields.sellerConcessions.label, (s) => s.sellerConcessions],
  [importFields.dataSource.label, (s) => s.dataSource],
  [importFields.verificationNote.label, (s) => s.verificationNote],
  ['In grid', (s) => s.inGrid],
  ['Excluded', (s) => s.excluded],
  ['Exclusion reason', (s) => s.exclusionReason],
];

/** The assignment's live sales as a CSV file (UTF-8 with a byte-order mark, CRLF line ends, as
 * spreadsheets expect). */
export function salesCsv(sales: readonly SaleRow[]): string {
  const lines = [columns.map(([header]) => csvCell(header)), ...sales.map((sale) => columns.map(([, pick]) => csvCell(pick(sale))))];
  return `\uFEFF${lines.map((cells) => cells.join(',')).join('\r\n')}\r\n`;
}

import { saleFields, type SaleFields, type SaleType } from '../../contracts/sales';
import { importFields, type ColumnMapping, type ImportField, type ImportProblem } from '../../contracts/sales-import';

const NUMERIC: ImportField[] = ['salePrice', 'floorArea', 'lon', 'lat', 'lotSize', 'bedrooms', 'bathrooms', 'yearBuilt', 'condition', 'quality', 'garageSpaces', 'sellerConcessions'];

/** "$1,234.50" → 1234.5; anything that is not a plain number (words, formulas, 1e999) → NaN. */
export function parseNumber(raw: string): number {
  const cleaned = raw.replace(/[\s$€£,_]/g, '');
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cleaned)) return Number.NaN;
  const value = Number(cleaned);
  return Number.isFinite(value) ? value : Number.NaN;
}

/** ISO dates only (2026-03-14 or 2026/03/14): day-first and month-first forms are ambiguous. */
export function parseIsoDate(raw: string): string | { error: string } {
  const m = /^(\d{4})[-/](\d{1,2})[-/](\d{1,2})$/.exec(raw.trim());
  if (!m) return { error: 'Use dates like 2026-03-14 (year-month-day).' };
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(Date.UTC(y, mo - 1, d));
  if (date.getUTCFullYear() !== y || date.getUTCMonth() !== mo - 1 || date.getUTCDate() !== d) return { error: `${raw} is not a real date.` };
  return date.toISOString().slice(0, 10);
}

const SALE_TYPE_WORDS: Array<[RegExp, SaleType]> = [
  [/^arm'?s?[\s-]*length|^arms|^market|^normal|^standard/, 'arms_length'],
  [/distress|short sale|foreclos|reo|bank/, 'distressed'],
  [/family|related|non[\s-]*arm/, 'family'],
  [/estate|probate/, 'estate'],
  [/new/, 'new_construction'],
  [/other/, 'other'],
];

export function parseSaleType(raw: string): SaleType | null {
  const n = raw.trim().toLowerCase().replace(/’/g, "'").replace(/_/g, ' ');
  if (!n) return 'arms_length';
  return SALE_TYPE_WORDS.find(([re]) => re.test(n))?.[1] ?? null;
}

export type RowResult = { ok: true; sale: SaleFields } | { ok: false; problems: ImportProblem[] };

/** Turns one CSV row into a sale, or says what is wrong with it, field by field. `rowNumber` counts
 * the header as row 1, as a spreadsheet shows it. `today` bounds sale dates (none in the future). */
export function validateRow(raw: Record<string, string | undefined>, mapping: ColumnMapping, rowNumber: number, today: string): RowResult {
  const problems: ImportProblem[] = [];
  const fail = (field: ImportField, message: string) => problems.push({ row: rowNumber, field: importFields[field].label, message });
  const value = (field: ImportField) => {
    const header = mapping[field];
    return header === undefined ? '' : (raw[header] ?? '').trim();
  };
  const candidate: Record<string, unknown> = {};
  for (const field of Object.keys(importFields) as ImportField[]) {
    const text = value(field);
    if (!text) {
      if (importFields[field].required) fail(field, `${importFields[field].label} is missing.`);
      else candidate[field] = field === 'sellerConcessions' ? 0 : field === 'saleType' ? 'arms_length' : null;
      continue;
    }
    if (NUMERIC.includes(field)) {
      const n = parseNumber(text);
      if (Number.isNaN(n)) fail(field, `“${text.slice(0, 40)}” is not a number.`);
      else candidate[field] = n;
    } else if (field === 'saleDate') {
      const d = parseIsoDate(text);
      if (typeof d !== 'string') fail(field, d.error);
      else if (d > today) fail(field, `${d} is in the future; a comparable must be a closed sale.`);
      else candidate[field] = d;
    } else if (field === 'saleType') {
      const t = parseSaleType(text);
      if (!t) fail(field, `“${text.slice(0, 40)}” is not a sale type Compline knows (arm’s length, distressed, family, estate, new construction, other).`);
      else candidate[field] = t;
    } else {
      candidate[field] = text;
    }
  }
  if ((candidate.lon == null) !== (candidate.lat == null) && !problems.some((p) => p.field === 'Longitude' || p.field === 'Latitude')) {
    fail(candidate.lon == null ? 'lon' : 'lat', 'Give both longitude and latitude, or neither.');
  }
  if (problems.length) return { ok: false, problems };
  const parsed = saleFields.safeParse(candidate);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = issue.path[0] as ImportField;
      fail(field in importFields ? field : 'address', issue.message);
    }
    return { ok: false, problems };
  }
  return { ok: true, sale: parsed.data };
}

/** The key two records of one sale share: the address folded to letters and digits, and the date. */
export function duplicateKey(address: string, saleDate: string): string {
  return `${address.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim()}|${saleDate}`;
}

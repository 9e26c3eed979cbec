import { distance as turfDistance, point } from '@turf/turf';
import type { Analysis } from '@contracts/analysis';
import type { Sale } from '@contracts/sales';
import { distanceUnit, type AreaUnit } from './figures';
import { residualBand, type ResidualBand } from './residual-band';

export type PointFlag = Analysis['groups'][number]['points'][number]['flags'][number];

/** A sale as the comparables step shows it: the record plus what is derived from it. */
export interface CompRow {
  sale: Sale;
  pricePerArea: number;
  /** Months from the sale date to the effective date (negative after it). */
  monthsSinceSale: number;
  /** To the subject, in miles (ft² assignments) or kilometres (m²); null without both locations. */
  distance: number | null;
  /** Externally studentized residual in the sale's own neighbourhood fit; null without a fit. */
  studentized: number | null;
  band: ResidualBand;
  flags: PointFlag[];
  /** The analysis's words on why the sale is flagged. */
  flagReason: string | null;
}

const DAYS_PER_MONTH = 365.25 / 12;
const MS_PER_DAY = 86_400_000;

function isoDay(value: string): number {
  return Date.parse(`${value}T00:00:00Z`);
}

export function monthsBetween(saleDate: string, effectiveDate: string): number {
  return (isoDay(effectiveDate) - isoDay(saleDate)) / MS_PER_DAY / DAYS_PER_MONTH;
}

interface PointInfo {
  studentized: number | null;
  flags: PointFlag[];
  reason: string | null;
  pooled: boolean;
}

/** Each sale's point in its own neighbourhood's fit; the pooled fit only where no group has it. */
function pointsBySale(analysis: Analysis | undefined): Map<number, PointInfo> {
  const found = new Map<number, PointInfo>();
  for (const group of analysis?.groups ?? []) {
    const reasons = new Map(group.flagged.map((f) => [f.saleId, f.reason]));
    for (const p of group.points) {
      const existing = found.get(p.saleId);
      if (existing && !existing.pooled) continue;
      if (existing && group.pooled) continue;
      found.set(p.saleId, { studentized: p.externallyStudentized, flags: p.flags, reason: reasons.get(p.saleId) ?? null, pooled: group.pooled });
    }
  }
  return found;
}

export interface CompRowInput {
  sales: readonly Sale[];
  analysis: Analysis | undefined;
  subjectLocation: { lon: number; lat: number } | null;
  effectiveDate: string;
  areaUnit: AreaUnit;
}

export function buildCompRows({ sales, analysis, subjectLocation, effectiveDate, areaUnit }: CompRowInput): CompRow[] {
  const points = pointsBySale(analysis);
  const units = distanceUnit(areaUnit);
  const origin = subjectLocation ? point([subjectLocation.lon, subjectLocation.lat]) : null;
  return sales.map((sale) => {
    const info = points.get(sale.id);
    const located = origin && sale.lon != null && sale.lat != null;
    return {
      sale,
      pricePerArea: sale.salePrice / sale.floorArea,
      monthsSinceSale: monthsBetween(sale.saleDate, effectiveDate),
      distance: located ? turfDistance(origin, point([sale.lon!, sale.lat!]), { units }) : null,
      studentized: info?.studentized ?? null,
      band: sale.excluded ? 'none' : residualBand(info?.studentized),
      flags: info?.flags ?? [],
      flagReason: info?.reason ?? null,
    };
  });
}

/** The table's and the map's filters, as the filter bar holds them (blank = no limit). */
export interface CompFilters {
  neighbourhood: string;
  soldFrom: string;
  soldTo: string;
  maxDistance: string;
  minArea: string;
  maxArea: string;
}

export const noFilters: CompFilters = { neighbourhood: '', soldFrom: '', soldTo: '', maxDistance: '', minArea: '', maxArea: '' };

const limit = (text: string): number | null => {
  if (text.trim() === '') return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : null;
};

export const NO_NEIGHBOURHOOD = '(none)';

export function filterCompRows(rows: readonly CompRow[], filters: CompFilters): CompRow[] {
  const maxDistance = limit(filters.maxDistance);
  const minArea = limit(filters.minArea);
  const maxArea = limit(filters.maxArea);
  return rows.filter(({ sale, distance }) => {
    if (filters.neighbourhood && (sale.neighbourhood ?? NO_NEIGHBOURHOOD) !== filters.neighbourhood) return false;
    if (filters.soldFrom && sale.saleDate < filters.soldFrom) return false;
    if (filters.soldTo && sale.saleDate > filters.soldTo) return false;
    if (maxDistance !== null && (distance === null || distance > maxDistance)) return false;
    if (minArea !== null && sale.floorArea < minArea) return false;
    if (maxArea !== null && sale.floorArea > maxArea) return false;
    return true;
  });
}

export function activeFilterCount(filters: CompFilters): number {
  return Object.values(filters).filter((v) => v.trim() !== '').length;
}

import type { AnalysisInput, AnalysisSale } from '../../server/analysis/market-analysis';

/** Inputs for the pure market analysis, built in memory. Addresses are invented (the demo town of
 * Port Ellery, which does not exist). */

let nextSaleId = 1;

export function analysisSale(overrides: Partial<AnalysisSale> = {}): AnalysisSale {
  const id = overrides.id ?? nextSaleId++;
  return {
    id,
    address: `${id} Netmender Road`,
    neighbourhood: 'Quarry Hill',
    salePrice: 400_000,
    saleDate: '2026-06-01',
    floorArea: 1_600,
    saleType: 'arms_length',
    excluded: false,
    exclusionReason: null,
    inGrid: false,
    ...overrides,
  };
}

export function analysisInput(sales: readonly AnalysisSale[], overrides: Partial<AnalysisInput> = {}): AnalysisInput {
  return {
    assignmentId: 1,
    dataRevision: 1,
    areaUnit: 'sqft',
    currency: 'USD',
    effectiveDate: '2026-11-15',
    timeAdjustment: false,
    subject: { floorArea: 1_400, neighbourhood: 'Quarry Hill' },
    sales,
    ...overrides,
  };
}

/**
 * Two integer patterns over five points: D = x deviations, E = a scatter with ΣE = 0 and ΣD·E = 0
 * (checked by hand: −2+2+0+2−2 = 0), and ΣD² = ΣE² = 10. A scatter orthogonal to the constant and
 * to x leaves the normal equations of least squares unchanged, so sales built as
 * y = a + b·x + c·E lie on a fitted line of exactly slope b and intercept a, and their
 * correlation is r = b·step / √((b·step)² + c²) (because ΣD² = ΣE²). Textbook least squares.
 */
export const D_PATTERN = [-2, -1, 0, 1, 2] as const;
export const E_PATTERN = [1, -2, 0, 2, -1] as const;

export interface LineSalesOptions {
  neighbourhood?: string | null;
  intercept: number;
  /** Price per unit of floor area. */
  slope: number;
  /** Dollars of scatter per unit of E_PATTERN (0 for sales exactly on the line). */
  scatter?: number;
  centreArea?: number;
  /** Floor area between neighbouring pattern points. */
  step?: number;
  /** How many times the five-point pattern repeats (n = 5 × copies). */
  copies?: number;
  saleDate?: string;
}

export function salesOnLine(options: LineSalesOptions): AnalysisSale[] {
  const { intercept, slope, scatter = 0, centreArea = 1_400, step = 100, copies = 1 } = options;
  const sales: AnalysisSale[] = [];
  for (let copy = 0; copy < copies; copy++) {
    D_PATTERN.forEach((d, i) => {
      const floorArea = centreArea + step * d;
      sales.push(
        analysisSale({
          neighbourhood: options.neighbourhood === undefined ? 'Quarry Hill' : options.neighbourhood,
          floorArea,
          salePrice: intercept + slope * floorArea + scatter * E_PATTERN[i],
          ...(options.saleDate ? { saleDate: options.saleDate } : {}),
        }),
      );
    });
  }
  return sales;
}

/** Every number anywhere in a value that is NaN or ±Infinity, with its path. */
export function nonFiniteNumbers(value: unknown, path = 'analysis'): Array<[string, number]> {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [[path, value]];
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFiniteNumbers(v, `${path}[${i}]`));
  if (value !== null && typeof value === 'object') {
    return Object.entries(value).flatMap(([k, v]) => nonFiniteNumbers(v, `${path}.${k}`));
  }
  return [];
}

import { describe, expect, it } from 'vitest';
import type { Analysis } from '@contracts/analysis';
import type { Sale } from '@contracts/sales';
import { buildCompRows, filterCompRows, monthsBetween, noFilters } from '../../client/features/sales/lib/comp-rows';
import { figuresFor } from '../../client/features/sales/lib/figures';
import { residualBand } from '../../client/features/sales/lib/residual-band';
import { salePopup, salesOnMap } from '../../client/features/sales/lib/map-sales';

// Invented Port Ellery sales around an invented subject; only the fields the comparables step reads matter.
const SUBJECT = { lon: -61.414137, lat: 44.706416 };

function sale(id: number, overrides: Partial<Sale> = {}): Sale {
  return {
    id, assignmentId: 1, address: `${id} Gull Street`, lon: SUBJECT.lon, lat: SUBJECT.lat + 0.01, neighbourhood: 'Quarry Hill',
    salePrice: 400_000, saleDate: '2026-05-15', floorArea: 1_600, lotSize: null, bedrooms: null, bathrooms: null, yearBuilt: null,
    condition: null, quality: null, garageSpaces: null, saleType: 'arms_length', sellerConcessions: 0, dataSource: null, verificationNote: null,
    inGrid: false, excluded: false, exclusionReason: null, coverPhotoId: null, photoCount: 0, version: 1, updatedAt: new Date('2026-11-01'),
    ...overrides,
  };
}

function point(saleId: number, studentized: number | null, flags: Analysis['groups'][number]['points'][number]['flags'] = []) {
  return { saleId, x: 1_600, y: 400_000, fitted: 400_000, residual: 0, leverage: 0.1, internallyStudentized: studentized, externallyStudentized: studentized, cooksDistance: 0.01, flags };
}

function group(neighbourhood: string, pooled: boolean, points: ReturnType<typeof point>[], flagged: Array<{ saleId: number; reason: string }> = []) {
  return {
    neighbourhood, pooled, n: points.length, fit: null, refusal: null, gate: null, prediction: null, points, warnings: [],
    flagged: flagged.map((f) => ({ ...f, address: '', neighbourhood, saleType: 'arms_length', flags: ['outlier' as const], residual: 0, residualPct: null, externallyStudentized: null, cooksDistance: null, leverage: 0, inGrid: false, revealedWhenSetAside: [] })),
  };
}

function analysis(groups: ReturnType<typeof group>[]): Analysis {
  return {
    assignmentId: 1, dataRevision: 1, areaUnit: 'sqft', currency: 'USD', effectiveDate: '2026-11-15', timeAdjustment: false,
    subject: { floorArea: 1_850, neighbourhood: 'Quarry Hill' }, subjectGroup: 'Quarry Hill', groups, trends: [], excluded: [], adjustedPrices: {}, warnings: [],
  };
}

describe('the residual scale', () => {
  it('splits teal below, grey on and rust above the line at 0.5, 1 and 2 studentized units', () => {
    expect([-3.1, -2, -1.99, -1, -0.6, -0.49, 0, 0.49, 0.5, 1, 1.99, 2, 4].map(residualBand)).toEqual([
      'low-strong', 'low-strong', 'low', 'low', 'low-soft', 'mid', 'mid', 'mid', 'high-soft', 'high', 'high', 'high-strong', 'high-strong',
    ]);
  });

  it('has no colour without a finite residual', () => {
    expect(residualBand(null)).toBe('none');
    expect(residualBand(Number.NaN)).toBe('none');
  });
});

describe('comp rows', () => {
  it('counts months back to the effective date with the average month length', () => {
    expect(monthsBetween('2026-11-15', '2026-11-15')).toBe(0);
    expect(monthsBetween('2025-11-15', '2026-11-15')).toBeCloseTo(12, 1);
    expect(monthsBetween('2026-12-15', '2026-11-15')).toBeLessThan(0);
  });

  it('takes each sale’s residual and flags from its own neighbourhood, not the pooled fit', () => {
    const fits = analysis([
      group('All neighbourhoods', true, [point(1, 0.1), point(2, 0.2)]),
      group('Quarry Hill', false, [point(1, -2.4, ['unusual', 'outlier'])], [{ saleId: 1, reason: 'sold 31% below the line' }]),
    ]);
    const [first, second] = buildCompRows({ sales: [sale(1), sale(2, { neighbourhood: null })], analysis: fits, subjectLocation: SUBJECT, effectiveDate: '2026-11-15', areaUnit: 'sqft' });
    expect(first).toMatchObject({ studentized: -2.4, band: 'low-strong', flags: ['unusual', 'outlier'], flagReason: 'sold 31% below the line' });
    expect(second).toMatchObject({ studentized: 0.2, band: 'mid', flags: [] });
  });

  it('measures distance in miles for square feet and kilometres for square metres', () => {
    // 0.01° of latitude is 1.112 km, 0.691 mi.
    const [miles] = buildCompRows({ sales: [sale(1)], analysis: undefined, subjectLocation: SUBJECT, effectiveDate: '2026-11-15', areaUnit: 'sqft' });
    const [km] = buildCompRows({ sales: [sale(1)], analysis: undefined, subjectLocation: SUBJECT, effectiveDate: '2026-11-15', areaUnit: 'sqm' });
    expect(miles.distance).toBeCloseTo(0.691, 2);
    expect(km.distance).toBeCloseTo(1.112, 2);
    expect(miles.pricePerArea).toBe(250);
  });

  it('leaves distance empty without both locations, and an excluded sale uncoloured', () => {
    const rows = buildCompRows({
      sales: [sale(1, { lon: null, lat: null }), sale(2, { excluded: true, exclusionReason: 'Family transfer' })],
      analysis: analysis([group('Quarry Hill', false, [point(2, 3)])]),
      subjectLocation: SUBJECT, effectiveDate: '2026-11-15', areaUnit: 'sqft',
    });
    expect(rows[0].distance).toBeNull();
    expect(rows[1].band).toBe('none');
    expect(salesOnMap(rows).map((s) => s.id)).toEqual([2]);
  });

  it('filters by neighbourhood, sale dates, distance and area, all limits inclusive', () => {
    const rows = buildCompRows({
      sales: [
        sale(1, { saleDate: '2026-01-10', floorArea: 1_400 }),
        sale(2, { saleDate: '2026-06-01', floorArea: 2_000, lat: SUBJECT.lat + 0.03 }),
        sale(3, { saleDate: '2026-09-30', floorArea: 1_800, neighbourhood: 'Tannery Row' }),
      ],
      analysis: undefined, subjectLocation: SUBJECT, effectiveDate: '2026-11-15', areaUnit: 'sqft',
    });
    const ids = (filters: Partial<typeof noFilters>) => filterCompRows(rows, { ...noFilters, ...filters }).map((r) => r.sale.id);
    expect(ids({})).toEqual([1, 2, 3]);
    expect(ids({ neighbourhood: 'Quarry Hill' })).toEqual([1, 2]);
    expect(ids({ soldFrom: '2026-06-01', soldTo: '2026-09-30' })).toEqual([2, 3]);
    expect(ids({ maxDistance: '1' })).toEqual([1, 3]);
    expect(ids({ minArea: '1800', maxArea: '2000' })).toEqual([2, 3]);
    expect(ids({ maxDistance: 'not a number' })).toEqual([1, 2, 3]);
  });
});

describe('figures in the assignment’s currency and unit', () => {
  it('formats prices, areas, rates and distances with Intl and the unit', () => {
    const usd = figuresFor('USD', 'sqft');
    expect(usd.area(1_850)).toBe(`${new Intl.NumberFormat().format(1_850)} ft²`);
    expect(usd.price(412_000)).toBe(new Intl.NumberFormat(undefined, { style: 'currency', currency: 'USD', maximumFractionDigits: 0, minimumFractionDigits: 0 }).format(412_000));
    expect(usd.pricePerArea(234.5)).toMatch(/235\/ft²$/);
    expect(usd.distanceSymbol).toBe('mi');
    const eur = figuresFor('EUR', 'sqm');
    expect(eur.pricePerArea(24.5)).toMatch(/24[.,]5\d?.*\/m²$|€.*\/m²$/);
    expect(eur.area(160)).toMatch(/160 m²$/);
    expect(eur.distanceSymbol).toBe('km');
  });

  it('builds a popup with the figures, the flag note and the cover thumbnail', () => {
    const [row] = buildCompRows({
      sales: [sale(7, { coverPhotoId: 42, saleType: 'family' })],
      analysis: analysis([group('Quarry Hill', false, [point(7, -3.2, ['outlier'])], [{ saleId: 7, reason: 'sold 40% below the line' }])]),
      subjectLocation: SUBJECT, effectiveDate: '2026-11-15', areaUnit: 'sqft',
    });
    const popup = salePopup(row, figuresFor('USD', 'sqft'));
    expect(popup.thumbUrl).toBe('/api/photos/42/thumb');
    expect(popup.note).toBe('sold 40% below the line');
    expect(popup.subtitle).toBe('Quarry Hill · Family or related party');
    expect(popup.facts.map(([label]) => label)).toEqual(['Price', 'Sold', 'Before effective date', 'Area', 'Per ft²', 'From subject']);
  });
});

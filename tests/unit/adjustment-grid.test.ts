import { describe, expect, it } from 'vitest';
import { computeGrid, GROSS_FLOOR, rateNeedsJustification, roundToIncrement } from '../../server/analysis/adjustment-grid';
import type { GridInput, GridLimits, GridResult, GridSaleInput } from '../../server/analysis/adjustment-grid';

// Invented data only. Every expected value is worked by hand in the comments. The 15 % net / 25 %
// gross limits and the default 1/gross weighting are common practice, no single source.
// 1.609344 km is one mile (1,609.344 m exactly).
const LIMITS: GridLimits = { netLimitPct: 15, grossLimitPct: 25, maxSaleAgeMonths: 12, maxDistanceKm: 1.609344, checkBracketing: true };

let nextId = 100;
function sale(over: Partial<GridSaleInput> = {}): GridSaleInput {
  const saleId = over.saleId ?? nextId++;
  return { saleId, address: `${saleId} Invented Lane`, salePrice: 400_000, floorArea: 1_800, sellerConcessions: 0, monthsBefore: 0, distanceKm: null, flaggedByFit: null, lineItems: [], weightPct: null, ...over };
}
/** Subject 1,800 ft², rate 110 /ft², no time adjustment, value increment 1,000, unless overridden. */
function grid(sales: GridSaleInput[], over: Partial<GridInput> = {}): GridResult {
  return computeGrid({ subjectArea: 1_800, monthlyRate: null, rate: 110, valueIncrement: 1_000, limits: LIMITS, sales, ...over });
}
const item = (feature: string, amount: number) => ({ feature, amount, note: 'invented' });
const codes = (r: GridResult) => r.checks.map((c) => c.code);
const checksFor = (r: GridResult, saleId: number) => r.checks.filter((c) => c.saleId === saleId).map((c) => c.code);

/*
 * The hand-worked grid. Subject 1,800 ft²; floor-area rate 110 /ft²; market conditions +0.4 %/month
 * (0.004), simple: time adjustment = price × 0.004 × months.
 *
 * Sale 1: 400,000; 1,700 ft²; 2.5 months; seller concessions 5,000; garage −4,000
 *   concession  −5,000
 *   time        400,000 × 0.004 × 2.5 = 1,600 × 2.5 = +4,000
 *   floor area  110 × (1,800 − 1,700) = 110 × 100 = +11,000
 *   line items  −4,000
 *   Σ adj       −5,000 + 4,000 + 11,000 − 4,000 = +6,000 → adjusted 406,000
 *   net         |6,000| / 400,000 = 0.015 (1.5 %)
 *   gross       (5,000 + 4,000 + 11,000 + 4,000) / 400,000 = 24,000 / 400,000 = 0.06 (6 %)
 * Sale 2: 420,000; 1,900 ft²; 7.5 months; no concessions; bathrooms +10,000
 *   concession  0
 *   time        420,000 × 0.004 × 7.5 = 1,680 × 7.5 = +12,600
 *   floor area  110 × (1,800 − 1,900) = −11,000
 *   line items  +10,000
 *   Σ adj       12,600 − 11,000 + 10,000 = +11,600 → adjusted 431,600
 *   net         11,600 / 420,000 = 0.0276190476… (2.76 %)
 *   gross       (12,600 + 11,000 + 10,000) / 420,000 = 33,600 / 420,000 = 0.08 (8 %)
 * Sale 3: 380,000; 1,800 ft²; 5 months; nothing else
 *   concession 0; time 380,000 × 0.004 × 5 = 1,520 × 5 = +7,600; floor area 110 × 0 = 0; items 0
 *   adjusted 387,600; net = gross = 7,600 / 380,000 = 0.02 (2 %)
 *
 * Default weights ∝ 1/gross: 1/0.06 = 50/3, 1/0.08 = 25/2, 1/0.02 = 50; total = (100 + 75 + 300)/6
 *   = 475/6. w1 = (50/3)/(475/6) = 100/475 = 4/19; w2 = 75/475 = 3/19; w3 = 300/475 = 12/19
 *   (400/19 = 21.0526… %, 300/19 = 15.7894… %, 1,200/19 = 63.1578… %; total 1,900/19 = 100 %).
 * Indicated value = (4 × 406,000 + 3 × 431,600 + 12 × 387,600) / 19
 *   = (1,624,000 + 1,294,800 + 4,651,200) / 19 = 7,570,000 / 19 = 398,421.052631…
 *   (19 × 398,421 = 7,569,999, remainder 1: 398,421 + 1/19).
 * Opinion to 1,000: 398,421.05 / 1,000 = 398.42 → 398 → 398,000.
 * Opinion to 5,000: 398,421.05 / 5,000 = 79.68 → 80 → 400,000.
 * Adjusted range [387,600, 431,600]: both opinions inside. Areas 1,700 < 1,800 < 1,900 bracket the
 * subject; 3 sales; all within 12 months; net and gross far under 15 % / 25 % → no checks at all.
 */
const HAND_SALES = [
  sale({ saleId: 1, salePrice: 400_000, floorArea: 1_700, monthsBefore: 2.5, sellerConcessions: 5_000, lineItems: [item('garage', -4_000)], distanceKm: 0.4 }),
  sale({ saleId: 2, salePrice: 420_000, floorArea: 1_900, monthsBefore: 7.5, lineItems: [item('bathrooms', 10_000)], distanceKm: 0.9 }),
  sale({ saleId: 3, salePrice: 380_000, floorArea: 1_800, monthsBefore: 5 }),
];
const handGrid = (over: Partial<GridInput> = {}, sales = HAND_SALES) => grid(sales, { monthlyRate: 0.004, ...over });

describe('the hand-worked three-sale grid', () => {
  const r = handGrid();
  it.each([
    // saleId, concession, time, area, line items, adjusted, net, gross, weight %
    [1, -5_000, 4_000, 11_000, -4_000, 406_000, 0.015, 0.06, 400 / 19],
    [2, 0, 12_600, -11_000, 10_000, 431_600, 11_600 / 420_000, 0.08, 300 / 19],
    [3, 0, 7_600, 0, 0, 387_600, 0.02, 0.02, 1_200 / 19],
  ])('sale %i: each adjustment, the adjusted price, net, gross and weight', (id, concession, time, area, items, adjusted, net, gross, weight) => {
    const row = r.rows.find((x) => x.saleId === id)!;
    expect(row.concessionAdjustment).toBeCloseTo(concession, 2);
    expect(row.timeAdjustment).toBeCloseTo(time, 2);
    expect(row.areaAdjustment).toBeCloseTo(area, 2);
    expect(row.lineItemTotal).toBeCloseTo(items, 2);
    expect(row.adjustedPrice).toBeCloseTo(adjusted, 2);
    expect(row.netAdjustmentPct).toBeCloseTo(net, 10);
    expect(row.grossAdjustmentPct).toBeCloseTo(gross, 10);
    expect(row.weightPct).toBeCloseTo(weight, 8);
    expect(row.weightIsDefault).toBe(true);
    expect(row.netOverLimit || row.grossOverLimit).toBe(false);
  });

  it('weights total 100 %, indicated value 7,570,000 / 19, opinion 398,000, range and no checks', () => {
    expect(r.weightsTotalPct).toBeCloseTo(100, 8);
    expect(r.indicatedValue!).toBeCloseTo(7_570_000 / 19, 2); // 398,421.05
    expect(r.opinionOfValue).toBe(398_000);
    expect(r.adjustedRange).toEqual([387_600, 431_600]);
    expect(r.checks).toEqual([]);
  });

  it('rounded to 5,000 the same grid gives 400,000', () => {
    expect(handGrid({ valueIncrement: 5_000 }).opinionOfValue).toBe(400_000);
  });
});

describe('weight overrides', () => {
  it('weights 50 / 30 / 20 give the weighted mean worked by hand', () => {
    // 0.5 × 406,000 + 0.3 × 431,600 + 0.2 × 387,600 = 203,000 + 129,480 + 77,520 = 410,000.
    const weights = [50, 30, 20];
    const r = handGrid({}, HAND_SALES.map((s, i) => ({ ...s, weightPct: weights[i] })));
    expect(r.weightsTotalPct).toBeCloseTo(100, 10);
    expect(r.indicatedValue!).toBeCloseTo(410_000, 2);
    expect(r.opinionOfValue).toBe(410_000);
    expect(r.rows.every((row) => !row.weightIsDefault)).toBe(true);
    expect(codes(r)).toEqual([]);
  });

  it('once any weight is typed, a blank one counts 0: sale 2 at 100 gives its adjusted 431,600', () => {
    const r = handGrid({}, HAND_SALES.map((s) => ({ ...s, weightPct: s.saleId === 2 ? 100 : null })));
    expect(r.rows.map((row) => row.weightPct)).toEqual([0, 100, 0]);
    expect(r.indicatedValue!).toBeCloseTo(431_600, 2);
  });

  it('weights 50 / 30 / 10 total 90: no indicated value, no opinion, a weights-total check', () => {
    const weights = [50, 30, 10];
    const r = handGrid({}, HAND_SALES.map((s, i) => ({ ...s, weightPct: weights[i] })));
    expect(r.weightsTotalPct).toBeCloseTo(90, 10);
    expect(r.indicatedValue).toBeNull();
    expect(r.opinionOfValue).toBeNull();
    expect(codes(r)).toEqual(['weights-total']);
    expect(r.checks[0].message).toContain('90.00%');
  });

  // A sale needing no adjustment has gross 0, and 1/0 is Infinity: normalising Infinity / Infinity
  // gives NaN weights. Its gross share is floored at GROSS_FLOOR = 0.005 (0.5 %) instead.
  it('a sale with no adjustment takes the GROSS_FLOOR weight, not an infinite one', () => {
    expect(GROSS_FLOOR).toBe(0.005);
    // Sale A: 400,000 at the subject's 1,800 ft², gross 0 → floored 0.005 → 1/0.005 = 200.
    // Sale B: 550,000, 1,700 ft²: 110 × 100 = +11,000; gross 11,000 / 550,000 = 0.02 → 1/0.02 = 50.
    // Weights 200/250 = 80 %, 50/250 = 20 %. Indicated 0.8 × 400,000 + 0.2 × 561,000
    //   = 320,000 + 112,200 = 432,200.
    const r = grid([sale({ saleId: 1 }), sale({ saleId: 2, salePrice: 550_000, floorArea: 1_700 })]);
    expect(r.rows.map((row) => row.grossAdjustmentPct)).toEqual([0, 0.02]);
    expect(r.rows[0].weightPct).toBeCloseTo(80, 10);
    expect(r.rows[1].weightPct).toBeCloseTo(20, 10);
    expect(r.indicatedValue!).toBeCloseTo(432_200, 2);
  });

  it('a gross share below the floor is floored too', () => {
    // Sale A gains "other" +1,000: gross 1,000 / 400,000 = 0.0025 < 0.005 → still 1/0.005 = 200, so
    // weights stay 80 / 20 (unfloored, 1/0.0025 = 400 would give 400/450 = 88.9 %). Adjusted A is
    // 401,000: 0.8 × 401,000 + 0.2 × 561,000 = 320,800 + 112,200 = 433,000.
    const r = grid([sale({ saleId: 1, lineItems: [item('other', 1_000)] }), sale({ saleId: 2, salePrice: 550_000, floorArea: 1_700 })]);
    expect(r.rows[0].weightPct).toBeCloseTo(80, 10);
    expect(r.indicatedValue!).toBeCloseTo(433_000, 2);
  });
});

describe('soft flags: net above 15 %, gross above 25 % (common practice, no single source; configurable)', () => {
  // No time adjustment; subject 1,800 ft²; rate 110.
  // Net over: 400,000, 1,300 ft²: 110 × 500 = +55,000; bathrooms +10,000 → net = gross = 65,000 /
  //   400,000 = 16.25 % → over 15 % net, under 25 % gross.
  // Gross over: 400,000, 1,300 ft²: +55,000; condition −50,000 → net 5,000 / 400,000 = 1.25 %,
  //   gross 105,000 / 400,000 = 26.25 % → gross only.
  // Moderate: 400,000, 1,400 ft²: 110 × 400 = +44,000; quality +6,000 → net = gross = 50,000 /
  //   400,000 = 12.5 % → under both defaults; over a 10 % limit.
  const netOver = sale({ saleId: 1, floorArea: 1_300, lineItems: [item('bathrooms', 10_000)] });
  const grossOver = sale({ saleId: 2, floorArea: 1_300, lineItems: [item('condition', -50_000)] });
  const moderate = sale({ saleId: 3, floorArea: 1_400, lineItems: [item('quality', 6_000)] });

  it('flags each sale over its own limit, and only that one', () => {
    const r = grid([netOver, grossOver, moderate]);
    expect(r.rows[0].netAdjustmentPct).toBeCloseTo(0.1625, 12);
    expect([r.rows[1].netAdjustmentPct, r.rows[1].grossAdjustmentPct].map((v) => v.toFixed(6))).toEqual(['0.012500', '0.262500']);
    expect(r.rows.map((row) => [row.netOverLimit, row.grossOverLimit])).toEqual([[true, false], [false, true], [false, false]]);
    expect(checksFor(r, 1)).toEqual(['net-over']);
    expect(checksFor(r, 2)).toEqual(['gross-over']);
    expect(checksFor(r, 3)).toEqual([]);
    expect(r.checks.find((c) => c.code === 'net-over')!.message).toContain('common practice, no single source');
  });

  it('net is an absolute value: a larger sale with a garage deduction flags too', () => {
    // 400,000, 2,300 ft²: 110 × (1,800 − 2,300) = −55,000; garage −10,000 → net |−65,000| / 400,000 = 16.25 %.
    const r = grid([sale({ saleId: 5, floorArea: 2_300, lineItems: [item('garage', -10_000)] })]);
    expect(r.rows[0].adjustedPrice).toBeCloseTo(335_000, 2);
    expect(r.rows[0].netAdjustmentPct).toBeCloseTo(0.1625, 12);
    expect(checksFor(r, 5)).toEqual(['net-over']);
  });

  it('the limits are configurable: at 10 % the 12.5 % sale flags', () => {
    expect(checksFor(grid([moderate], { limits: { ...LIMITS, netLimitPct: 10 } }), 3)).toEqual(['net-over']);
    expect(checksFor(grid([moderate], { limits: { ...LIMITS, grossLimitPct: 10 } }), 3)).toEqual(['gross-over']);
  });

  it('a sale exactly at the limit is not above it (14 %: 0.14 × 100 is 14.000000000000002 in floating point)', () => {
    // 400,000, 1,400 ft²: +44,000; quality +12,000 → 56,000 / 400,000 = 14 % net and gross.
    const atLimit = sale({ saleId: 4, floorArea: 1_400, lineItems: [item('quality', 12_000)] });
    const r = grid([atLimit], { limits: { ...LIMITS, netLimitPct: 14, grossLimitPct: 14 } });
    expect(r.rows[0].netAdjustmentPct).toBeCloseTo(0.14, 12);
    expect([r.rows[0].netOverLimit, r.rows[0].grossOverLimit]).toEqual([false, false]);
  });
});

describe('the floor-area rate needs a written justification', () => {
  it.each([
    [false, null, true], // correlation gate fails: the slope is not market support
    [true, 120, true], // the appraiser typed a rate instead of the fit's
    [false, 120, true],
    [true, null, false], // gate passes and the fit's rounded slope is used
  ])('gate passes %s, typed rate %s → %s', (gatePasses, typedRate, needed) => {
    expect(rateNeedsJustification(gatePasses, typedRate)).toBe(needed);
  });
});

describe('bracketing of the subject’s 1,800 ft²', () => {
  const areas = (list: number[]) => list.map((floorArea) => sale({ floorArea }));
  const bracketing = (r: GridResult) => r.checks.filter((c) => c.code === 'not-bracketed');

  it('every sale larger → not-bracketed, "larger"', () => {
    const found = bracketing(grid(areas([1_900, 2_000, 2_100])));
    expect(found).toHaveLength(1);
    expect(found[0].message).toContain('larger');
  });
  it('every sale smaller → not-bracketed, "smaller"', () => {
    const found = bracketing(grid(areas([1_500, 1_600, 1_700])));
    expect(found).toHaveLength(1);
    expect(found[0].message).toContain('smaller');
  });
  it('mixed sizes → no bracketing check', () => {
    expect(bracketing(grid(areas([1_700, 1_900, 2_000])))).toEqual([]);
  });
  it('checkBracketing false → none, even when every sale is larger', () => {
    expect(bracketing(grid(areas([1_900, 2_000, 2_100]), { limits: { ...LIMITS, checkBracketing: false } }))).toEqual([]);
  });
});

describe('the other checks', () => {
  it('fewer than three sales', () => {
    expect(codes(grid([sale(), sale(), sale()]))).not.toContain('few-sales');
    const two = grid([sale(), sale()]);
    expect(codes(two)).toContain('few-sales');
    expect(two.checks.find((c) => c.code === 'few-sales')!.message).toContain('Only 2 closed sales');
    expect(grid([sale()]).checks.find((c) => c.code === 'few-sales')!.message).toContain('Only 1 closed sale in the grid');
  });

  it('a sale older than 12 months (12.5 flags; exactly 12 does not)', () => {
    const r = grid([sale({ saleId: 1, monthsBefore: 12.5 }), sale({ saleId: 2, monthsBefore: 12 }), sale({ saleId: 3 })]);
    expect(checksFor(r, 1)).toEqual(['old-sale']);
    expect(checksFor(r, 2)).toEqual([]);
  });

  it('a sale farther than 1.609344 km (1.7 flags; 1.6 and an unknown distance do not)', () => {
    const r = grid([sale({ saleId: 1, distanceKm: 1.7 }), sale({ saleId: 2, distanceKm: 1.6 }), sale({ saleId: 3, distanceKm: null })]);
    expect(checksFor(r, 1)).toEqual(['far-sale']);
    expect([...checksFor(r, 2), ...checksFor(r, 3)]).toEqual([]);
  });

  it('a sale flagged by the fit carries the fit’s reason', () => {
    const reason = 'externally studentized residual 3.4: outlier';
    const r = grid([sale({ saleId: 1, flaggedByFit: reason }), sale({ saleId: 2 }), sale({ saleId: 3 })]);
    expect(checksFor(r, 1)).toEqual(['flagged-sale']);
    expect(r.checks[0].message).toContain(reason);
    expect(codes(r)).toEqual(['flagged-sale']);
  });

  // Weights ≥ 0 that total 100 % make the indicated value a convex combination of the adjusted
  // prices, so it always lies inside their range; only rounding to a coarse increment can leave it.
  // Three sales at the subject's size, no rate: no adjustments, all floored alike, weights 1/3 each.
  it('rounding to 50,000 can push the opinion outside the adjusted range', () => {
    // 412,000 / 418,000 / 415,000: mean (412,000 + 418,000 + 415,000) / 3 = 1,245,000 / 3 = 415,000.
    // To 1,000 → 415,000, inside [412,000, 418,000]. To 50,000: 415,000 / 50,000 = 8.3 → 8 → 400,000,
    // below 412,000.
    const low = [412_000, 418_000, 415_000].map((salePrice) => sale({ salePrice }));
    const fine = grid(low);
    expect(fine.indicatedValue!).toBeCloseTo(415_000, 2);
    expect(fine.opinionOfValue).toBe(415_000);
    expect(codes(fine)).toEqual([]);
    const coarse = grid(low, { valueIncrement: 50_000 });
    expect(coarse.adjustedRange).toEqual([412_000, 418_000]);
    expect(coarse.opinionOfValue).toBe(400_000);
    expect(codes(coarse)).toEqual(['outside-range']);
    // 432,000 / 438,000 / 435,000: mean 1,305,000 / 3 = 435,000; / 50,000 = 8.7 → 9 → 450,000 > 438,000.
    const high = grid([432_000, 438_000, 435_000].map((salePrice) => sale({ salePrice })), { valueIncrement: 50_000 });
    expect(high.opinionOfValue).toBe(450_000);
    expect(codes(high)).toEqual(['outside-range']);
  });
});

describe('roundToIncrement', () => {
  it.each([
    [432_500, 1_000, 433_000], // 432.5 → Math.round rounds a half up → 433
    [432_499.99, 1_000, 432_000], // 432.49999 → 432
    [433_499.99, 1_000, 433_000],
    [398_421.05, 5_000, 400_000], // 79.68 → 80
    [-432_500, 1_000, -432_000], // −432.5 → Math.round goes toward +∞ → −432, not −433 (not "away from zero")
    [-432_500.01, 1_000, -433_000], // −432.50001 → −433
    [108.6, 5, 110], // a fit slope of 108.6 at a rate increment of 5: 21.72 → 22 → 110
    [112.5, 5, 115], // 22.5 → 23
    [398_421.05, 0, 398_421.05], // increment 0 leaves the value
    [398_421.05, -1_000, 398_421.05], // so does a negative one
  ])('%f to %f → %f', (value, increment, expected) => {
    expect(roundToIncrement(value, increment)).toBeCloseTo(expected, 6);
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { linearRegression } from 'simple-statistics';
import { analysisResponse, analysisWireResponse, analysisWireSchema, expandAnalysis, type Analysis, type GroupAnalysis } from '../../server/contracts/analysis';
import { analyseMarket, analysisWire, transportWire } from '../../server/analysis/market-analysis';
import { analysisInput, analysisSale, nonFiniteNumbers, salesOnLine } from '../factories/analysis';

// Sales built with salesOnLine lie on a least-squares line of exactly the slope and intercept
// they are built with (the scatter is orthogonal to 1 and x: see tests/factories/analysis.ts).

function group(analysis: Analysis, name: string): GroupAnalysis {
  const found = analysis.groups.find((g) => g.neighbourhood === name);
  if (!found) throw new Error(`no group ${name}; groups: ${analysis.groups.map((g) => g.neighbourhood).join(', ')}`);
  return found;
}

const idsOf = (list: ReadonlyArray<{ id: number }>) => list.map((s) => s.id).sort((a, b) => a - b);
const pointIds = (g: GroupAnalysis) => g.points.map((p) => p.saleId).sort((a, b) => a - b);

describe('groups', () => {
  it('fits each neighbourhood on its own sales, subject’s first, and a pooled group over all usable sales last', () => {
    const quarry = salesOnLine({ neighbourhood: 'Quarry Hill', intercept: 55_000, slope: 240, scatter: 3_000, copies: 2 });
    const tannery = salesOnLine({ neighbourhood: 'Tannery Row', intercept: 35_000, slope: 185, scatter: 2_000 });
    const unplaced = salesOnLine({ neighbourhood: null, intercept: 20_000, slope: 200, scatter: 1_000 });
    const all = [...tannery, ...unplaced, ...quarry];
    const result = analyseMarket(analysisInput(all));

    expect(result.groups[0].neighbourhood).toBe('Quarry Hill');
    expect(result.subjectGroup).toBe('Quarry Hill');
    expect(result.groups.map((g) => g.neighbourhood).sort()).toEqual(['All neighbourhoods', 'No neighbourhood', 'Quarry Hill', 'Tannery Row']);
    expect(result.groups.filter((g) => g.pooled).map((g) => g.neighbourhood)).toEqual(['All neighbourhoods']);
    expect(result.groups.at(-1)!.pooled).toBe(true);

    for (const [name, members, slope, intercept] of [
      ['Quarry Hill', quarry, 240, 55_000],
      ['Tannery Row', tannery, 185, 35_000],
      ['No neighbourhood', unplaced, 200, 20_000],
    ] as const) {
      const g = group(result, name);
      expect(g.n, name).toBe(members.length);
      expect(pointIds(g), name).toEqual(idsOf(members));
      expect(g.fit!.slope, name).toBeCloseTo(slope, 8);
      expect(g.fit!.intercept, name).toBeCloseTo(intercept, 4);
    }
    const pooled = group(result, 'All neighbourhoods');
    expect(pooled.n).toBe(all.length);
    expect(pointIds(pooled)).toEqual(idsOf(all));
    // Reference: simple-statistics' linearRegression on the same 20 points.
    const reference = linearRegression(all.map((s) => [s.floorArea, s.salePrice]));
    expect(pooled.fit!.slope).toBeCloseTo(reference.m, 6);
    expect(pooled.fit!.intercept).toBeCloseTo(reference.b, 2);
  });

  it('leaves excluded sales out of every fit, trend and adjusted price, and lists them with their reasons', () => {
    const kept = salesOnLine({ neighbourhood: 'Quarry Hill', intercept: 55_000, slope: 240, scatter: 3_000, copies: 2 });
    const family = analysisSale({ neighbourhood: 'Quarry Hill', floorArea: 1_600, salePrice: 250_000, excluded: true, exclusionReason: 'Sold between relatives.' });
    const onlyInOrchard = analysisSale({ neighbourhood: 'Orchard Rise', floorArea: 1_900, salePrice: 650_000, excluded: true, exclusionReason: null });
    const result = analyseMarket(analysisInput([...kept, family, onlyInOrchard], { timeAdjustment: true }));

    const quarry = group(result, 'Quarry Hill');
    expect(quarry.n).toBe(10);
    expect(quarry.fit!.slope).toBeCloseTo(240, 8); // with the family sale in, the slope would drop
    expect(group(result, 'All neighbourhoods').n).toBe(10);
    expect(result.groups.map((g) => g.neighbourhood)).not.toContain('Orchard Rise');
    const excludedIds = [family.id, onlyInOrchard.id];
    for (const g of result.groups) {
      expect(g.points.map((p) => p.saleId).filter((id) => excludedIds.includes(id)), g.neighbourhood).toEqual([]);
      expect(g.flagged.map((f) => f.saleId).filter((id) => excludedIds.includes(id)), g.neighbourhood).toEqual([]);
    }
    for (const t of result.trends) expect(t.points.map((p) => p.saleId).filter((id) => excludedIds.includes(id))).toEqual([]);
    expect(Object.keys(result.adjustedPrices).sort()).toEqual(idsOf(kept).map(String).sort());
    expect(result.excluded).toEqual([
      { saleId: family.id, address: family.address, reason: 'Sold between relatives.' },
      { saleId: onlyInOrchard.id, address: onlyInOrchard.address, reason: null },
    ]);
  });

  it('predicts at the subject only in the subject’s neighbourhood group and the pooled group', () => {
    const quarry = salesOnLine({ neighbourhood: 'Quarry Hill', intercept: 55_000, slope: 240, scatter: 3_000, copies: 2 });
    const tannery = salesOnLine({ neighbourhood: 'Tannery Row', intercept: 35_000, slope: 185, scatter: 2_000, copies: 2 });
    const result = analyseMarket(analysisInput([...quarry, ...tannery], { subject: { floorArea: 1_450, neighbourhood: 'Quarry Hill' } }));

    const prediction = group(result, 'Quarry Hill').prediction!;
    expect(prediction.x0).toBe(1_450);
    expect(prediction.estimate).toBeCloseTo(55_000 + 240 * 1_450, 4); // on the exact line
    expect(prediction.lower).toBeLessThan(prediction.estimate);
    expect(prediction.upper).toBeGreaterThan(prediction.estimate);
    expect(prediction.extrapolated).toBe(false);
    expect(group(result, 'Tannery Row').prediction).toBeNull();
    expect(group(result, 'All neighbourhoods').prediction!.x0).toBe(1_450);
  });

  it('predicts nowhere without a subject floor area, and says what is missing', () => {
    const quarry = salesOnLine({ neighbourhood: 'Quarry Hill', intercept: 55_000, slope: 240, scatter: 3_000, copies: 2 });
    const noArea = analyseMarket(analysisInput(quarry, { subject: { floorArea: null, neighbourhood: 'Quarry Hill' } }));
    expect(noArea.groups.map((g) => g.prediction)).toEqual([null, null]);
    expect(noArea.warnings.join(' ')).toMatch(/floor area/);

    const elsewhere = analyseMarket(analysisInput(quarry, { subject: { floorArea: 1_450, neighbourhood: 'Saltmarsh Flats' } }));
    expect(elsewhere.subjectGroup).toBeNull();
    expect(group(elsewhere, 'Quarry Hill').prediction).toBeNull();
    expect(group(elsewhere, 'All neighbourhoods').prediction).not.toBeNull();
    expect(elsewhere.warnings.join(' ')).toContain('Saltmarsh Flats');
  });
});

describe('correlation gate (|r| ≥ 0.5: common practice, no single source)', () => {
  // y = a + b·x + c·E with x = 1400 + 100·D: r = 100b / √((100b)² + c²). With 100b = β·2000 and
  // c = γ·2000 for a Pythagorean triple (β, γ, h), r = β/h exactly.
  it.each([
    [3, 4, 5, true],
    [33, 56, 65, true], // r = 0.5077, just above the gate
    [8, 15, 17, false], // r = 0.4706, just below
    [7, 24, 25, false],
  ])('β = %i, γ = %i, h = %i: passes %s', (beta, gamma, hypotenuse, passes) => {
    const expectedR = beta / hypotenuse;
    const sales = salesOnLine({ intercept: 100_000, slope: (beta * 2_000) / 100, scatter: gamma * 2_000, copies: 2 });
    const g = group(analyseMarket(analysisInput(sales)), 'Quarry Hill');

    expect(g.fit!.r).toBeCloseTo(expectedR, 12);
    expect(g.gate!.passes).toBe(passes);
    expect(g.gate!.threshold).toBe(0.5);
    expect(g.gate!.message).toContain(`r = ${expectedR.toFixed(2)}`);
    if (passes) {
      expect(g.warnings).toEqual([]); // n = 10, subject inside the range, rising line
    } else {
      expect(g.gate!.message).toMatch(/not market support/);
      expect(g.warnings).toContain(g.gate!.message);
    }
  });

  it('passes a strong falling line on |r| but warns that it falls', () => {
    const sales = salesOnLine({ intercept: 900_000, slope: -60, scatter: 8_000, copies: 2 }); // r = −3/5
    const g = group(analyseMarket(analysisInput(sales)), 'Quarry Hill');
    expect(g.fit!.r).toBeCloseTo(-0.6, 12);
    expect(g.gate!.passes).toBe(true);
    expect(g.warnings.join(' ')).toMatch(/falls/);
  });

  it('fails with a message when every price is the same (r undefined)', () => {
    const sales = salesOnLine({ intercept: 400_000, slope: 0, copies: 2 });
    const g = group(analyseMarket(analysisInput(sales)), 'Quarry Hill');
    expect(g.fit!.r).toBeNull();
    expect(g.gate!.passes).toBe(false);
    expect(g.gate!.message).toMatch(/same price/);
  });
});

describe('warnings', () => {
  const ten = () => salesOnLine({ intercept: 55_000, slope: 240, scatter: 3_000, copies: 2 });

  it('warns below 10 sales and not at 10', () => {
    const nine = group(analyseMarket(analysisInput(ten().slice(1))), 'Quarry Hill');
    expect(nine.n).toBe(9);
    expect(nine.warnings.filter((w) => w.includes('Only 9 sales'))).toHaveLength(1);
    const full = group(analyseMarket(analysisInput(ten())), 'Quarry Hill');
    expect(full.warnings.filter((w) => /Only \d+ sales/.test(w))).toEqual([]);
  });

  it.each([
    [1_199, true],
    [1_200, false],
    [1_600, false],
    [2_000, true],
  ])('subject at %i ft² against sales of 1,200–1,600: extrapolated %s', (subjectArea, extrapolated) => {
    const g = group(analyseMarket(analysisInput(ten(), { subject: { floorArea: subjectArea, neighbourhood: 'Quarry Hill' } })), 'Quarry Hill');
    expect(g.prediction!.extrapolated).toBe(extrapolated);
    const warning = g.warnings.filter((w) => /extrapolat/.test(w));
    expect(warning).toHaveLength(extrapolated ? 1 : 0);
    if (extrapolated) expect(warning[0]).toContain(`${subjectArea.toLocaleString('en-US')} ft²`);
  });
});

describe('degenerate input: a typed refusal, never NaN', () => {
  function expectCleanOutput(result: Analysis) {
    expect(nonFiniteNumbers(result)).toEqual([]);
    // JSON turns NaN and ±Infinity into null, which the response contract would then reject.
    expect(analysisResponse.safeParse(JSON.parse(JSON.stringify(result))).success).toBe(true);
  }

  it('refuses a group of 2 sales and a group whose sales share one floor area, with messages', () => {
    const two = [analysisSale({ floorArea: 1_500, salePrice: 410_000 }), analysisSale({ floorArea: 1_700, salePrice: 455_000 })];
    const sameArea = [390_000, 402_000, 415_000].map((salePrice, i) =>
      analysisSale({ neighbourhood: 'Tannery Row', floorArea: 1_500, salePrice, saleDate: `2026-0${i + 3}-10` }));
    for (const timeAdjustment of [false, true]) {
      const result = analyseMarket(analysisInput([...two, ...sameArea], { timeAdjustment }));
      for (const [name, reason] of [['Quarry Hill', 'too-few-points'], ['Tannery Row', 'no-spread-in-x']] as const) {
        const g = group(result, name);
        expect(g.refusal?.reason, name).toBe(reason);
        expect(g.refusal!.message.length, name).toBeGreaterThan(20);
        expect(g.warnings, name).toEqual([g.refusal!.message]);
        expect([g.fit, g.gate, g.prediction], name).toEqual([null, null, null]);
        expect([g.points, g.flagged], name).toEqual([[], []]);
      }
      expect(group(result, 'All neighbourhoods').fit).not.toBeNull(); // 5 sales at 2 areas
      expectCleanOutput(result);
    }
  });

  it('answers an empty comp set, and one whose every sale is excluded, without a fit', () => {
    const excluded = salesOnLine({ intercept: 55_000, slope: 240 }).map((s) => ({ ...s, excluded: true, exclusionReason: 'Not comparable.' }));
    for (const sales of [[], excluded]) {
      const result = analyseMarket(analysisInput(sales, { timeAdjustment: true }));
      expect(result.groups.map((g) => [g.neighbourhood, g.n, g.refusal?.reason])).toEqual([['All neighbourhoods', 0, 'too-few-points']]);
      expect(result.trends.map((t) => [t.n, t.monthlyRate])).toEqual([[0, null]]);
      expect(result.warnings.join(' ')).toContain('No usable sale lies in Quarry Hill');
      expectCleanOutput(result);
    }
  });

  it('never puts NaN or Infinity anywhere for small, tied or flat comp sets (property)', () => {
    const saleArb = fc.record({
      neighbourhood: fc.constantFrom('Quarry Hill', 'Tannery Row', null),
      floorArea: fc.constantFrom(900, 1_500, 1_500, 2_400),
      salePrice: fc.constantFrom(150_000, 400_000, 400_000, 1_250_000),
      saleDate: fc.constantFrom('2025-06-01', '2026-03-15', '2026-03-15', '2026-11-14'),
      excluded: fc.boolean(),
    });
    fc.assert(
      fc.property(fc.array(saleArb, { maxLength: 8 }), fc.boolean(), fc.constantFrom(null, 1_500, 5_000), (drafts, timeAdjustment, floorArea) => {
        const sales = drafts.map((d) => analysisSale(d));
        const result = analyseMarket(analysisInput(sales, { timeAdjustment, subject: { floorArea, neighbourhood: 'Quarry Hill' } }));
        expect(nonFiniteNumbers(result)).toEqual([]);
        expect(analysisResponse.safeParse(JSON.parse(JSON.stringify(result))).success).toBe(true);
      }),
      { numRuns: 300, seed: 20261115 },
    );
  });
});

describe('the answer on the wire: per-sale figures in columns', () => {
  const sales = [
    ...salesOnLine({ neighbourhood: 'Quarry Hill', intercept: 55_000, slope: 240, scatter: 3_000, copies: 3 }),
    ...salesOnLine({ neighbourhood: 'Tannery Row', intercept: 35_000, slope: 185, scatter: 2_000 }),
    analysisSale({ neighbourhood: 'Quarry Hill', floorArea: 1_500, salePrice: 150_000 }),
    ...[1_500, 1_500].map((floorArea) => analysisSale({ neighbourhood: 'Orchard Rise', floorArea })),
  ];
  const input = analysisInput(sales, { timeAdjustment: true });

  it('fits its schema through JSON and expands to exactly the rows analyseMarket gives', () => {
    const wire = analysisWire(input);
    const travelled = analysisWireSchema.parse(JSON.parse(JSON.stringify(wire)));
    expect(expandAnalysis(travelled)).toEqual(analyseMarket(input));
    // A refused fit (Orchard Rise: one floor area) travels without point columns.
    expect(wire.groups.find((g) => g.neighbourhood === 'Orchard Rise')!.points).toBeNull();
  });

  it('rounded for transport: money to the cent, statistics to six significant digits, flags untouched', () => {
    const exact = analyseMarket(input);
    const sent = analysisWireResponse.parse(JSON.parse(JSON.stringify(transportWire(analysisWire(input)))));
    expect(sent.groups.map((g) => g.fit)).toEqual(exact.groups.map((g) => g.fit));
    const flagged = exact.groups.flatMap((g) => g.points.filter((p) => p.flags.length > 0));
    expect(flagged.length).toBeGreaterThan(0);
    exact.groups.forEach((g, i) => {
      g.points.forEach((p, j) => {
        const q = sent.groups[i].points[j];
        expect(q.saleId).toBe(p.saleId);
        expect(q.flags).toEqual(p.flags);
        for (const key of ['y', 'fitted', 'residual'] as const) expect(Math.abs(q[key] - p[key])).toBeLessThanOrEqual(0.005 + 1e-9 * Math.abs(p[key]));
        for (const key of ['leverage', 'internallyStudentized', 'externallyStudentized', 'cooksDistance'] as const) {
          const [a, b] = [q[key], p[key]];
          if (b === null) expect(a).toBeNull();
          else expect(Math.abs(a! - b)).toBeLessThanOrEqual(5e-6 * Math.abs(b));
        }
      });
    });
    // Rounded figures print shorter than full doubles.
    const text = JSON.stringify(transportWire(analysisWire(input)));
    expect(text.length).toBeLessThan(JSON.stringify(analysisWire(input)).length);
  });
});

import { describe, expect, it } from 'vitest';
import { linearRegression } from 'simple-statistics';
import { analyseMarket } from '../../server/analysis/market-analysis';
import { revealMaskedOutliers } from '../../server/analysis/masked-outliers';
import { fitLine, type LineFit, type LineFitOk } from '../../server/analysis/regression';
import { analysisInput, analysisSale } from '../factories/analysis';

// The masking effect (Hadi & Simonoff, JASA 88 (1993) 1264–1272, as cited in masked-outliers.ts;
// citation not re-checked here): one gross outlier drags the line
// so far that a second one no longer stands out. Here the gross one is a floor area keyed with an
// extra zero; the hidden one sold at 60% of the line (a family transfer, say). All data invented.

function ok(fit: LineFit): LineFitOk {
  if (!fit.ok) throw new Error(`expected a fit, got ${fit.reason}: ${fit.message}`);
  return fit;
}

// Fourteen market sales on $200/ft² + $50,000 with a fixed, irregular scatter.
const SCATTER = [3_100, -4_200, 1_800, -900, 5_200, -2_600, 700, -3_900, 2_400, -1_500, 4_100, -3_700, 2_000, -1_000];
const market = SCATTER.map((e, i) => ({ x: 1_000 + 120 * i, y: 50_000 + 200 * (1_000 + 120 * i) + e }));
const hidden = { x: 2_300, y: 0.6 * (50_000 + 200 * 2_300) }; // 306,000 for a 510,000 house
const typo = { x: 16_400, y: 50_000 + 200 * 1_640 }; // a normal price for 1,640 ft², keyed as 16,400
const HIDDEN = market.length;
const TYPO = market.length + 1;
const points = [...market, hidden, typo];

function saleSet() {
  const sales = points.map((p) => analysisSale({ floorArea: p.x, salePrice: p.y }));
  return { sales, hiddenSale: sales[HIDDEN], typoSale: sales[TYPO] };
}

describe('the data mask as intended (checked with fitLine directly)', () => {
  it('the plain fit flags the typo as an outlier and does not flag the hidden sale at all', () => {
    const plain = ok(fitLine(points));
    expect(plain.points[TYPO].flags).toContain('outlier');
    expect(plain.points[HIDDEN].flags).toEqual([]);
  });

  it('without the typo, the hidden sale is an outlier (|externally studentized| > 3)', () => {
    const withoutTypo = ok(fitLine([...market, hidden]));
    expect(Math.abs(withoutTypo.points[HIDDEN].externallyStudentized!)).toBeGreaterThan(3);
    expect(withoutTypo.points[HIDDEN].flags).toContain('outlier');
  });
});

describe('revealMaskedOutliers', () => {
  it('reveals the hidden sale once the typo is set aside', () => {
    const revealed = revealMaskedOutliers(points, [TYPO]);
    expect(revealed.map((r) => [r.index, r.setAside])).toEqual([[HIDDEN, [TYPO]]]);
    expect(revealed[0].point.residual).toBeLessThan(0);
    expect(Math.abs(revealed[0].point.externallyStudentized!)).toBeGreaterThan(3);
  });

  it('reveals nothing when the full fit flags no outlier', () => {
    expect(revealMaskedOutliers(points, [])).toEqual([]);
  });

  it('reveals nothing more when the one outlier hides no other', () => {
    const clean = [...market, typo];
    expect(ok(fitLine(clean)).points[market.length].flags).toContain('outlier');
    expect(revealMaskedOutliers(clean, [market.length])).toEqual([]);
  });
});

describe('masked outliers in the market analysis', () => {
  it('lists the hidden sale as an outlier, naming the typo sale in its reason', () => {
    const { sales, hiddenSale, typoSale } = saleSet();
    const quarry = analyseMarket(analysisInput(sales)).groups.find((g) => g.neighbourhood === 'Quarry Hill')!;

    const typoFlag = quarry.flagged.find((f) => f.saleId === typoSale.id)!;
    expect(typoFlag.flags).toContain('outlier');
    expect(typoFlag.revealedWhenSetAside).toEqual([]);

    const hiddenFlag = quarry.flagged.find((f) => f.saleId === hiddenSale.id);
    expect(hiddenFlag).toBeDefined();
    expect(hiddenFlag!.flags).toContain('outlier');
    expect(hiddenFlag!.revealedWhenSetAside).toEqual([typoSale.id]);
    expect(hiddenFlag!.reason).toContain(typoSale.address);
    expect(hiddenFlag!.reason).toMatch(/below the line/);

    // The percentage in the words, recomputed with simple-statistics on the sales without the typo.
    const line = linearRegression([...market, hidden].map((p) => [p.x, p.y]));
    const fittedAtHidden = line.b + line.m * hidden.x;
    const percent = Math.round(((fittedAtHidden - hidden.y) / fittedAtHidden) * 100);
    expect(hiddenFlag!.reason).toContain(`${percent}% below`);
  });

  it('adds questions but never changes the fit itself', () => {
    const { sales } = saleSet();
    const quarry = analyseMarket(analysisInput(sales)).groups.find((g) => g.neighbourhood === 'Quarry Hill')!;
    const reference = linearRegression(points.map((p) => [p.x, p.y]));
    expect(quarry.n).toBe(points.length);
    expect(quarry.fit!.slope).toBeCloseTo(reference.m, 8);
    expect(quarry.fit!.intercept).toBeCloseTo(reference.b, 3);
  });

  it('once the typo is excluded, the plain fit flags the sale itself (nothing left to reveal)', () => {
    const { sales, hiddenSale, typoSale } = saleSet();
    const withTypoExcluded = sales.map((s) => (s.id === typoSale.id ? { ...s, excluded: true, exclusionReason: 'Floor area keyed with an extra zero.' } : s));
    const quarry = analyseMarket(analysisInput(withTypoExcluded)).groups.find((g) => g.neighbourhood === 'Quarry Hill')!;
    const hiddenFlag = quarry.flagged.find((f) => f.saleId === hiddenSale.id)!;
    expect(hiddenFlag.flags).toContain('outlier');
    expect(hiddenFlag.revealedWhenSetAside).toEqual([]);
    expect(hiddenFlag.reason).not.toContain(typoSale.address);
  });
});

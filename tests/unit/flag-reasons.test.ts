import { describe, expect, it } from 'vitest';
import { describeFlags, flagReasons } from '../../server/analysis/flag-reasons';
import { fitLine, type FitPoint, type PointFlag } from '../../server/analysis/regression';

const context = { n: 12, xMin: 1180, xMax: 2890 };

function point(overrides: Partial<FitPoint> & { flags: PointFlag[] }): FitPoint {
  return {
    x: 1700, y: 300000, fitted: 300000, residual: 0, leverage: 0.1,
    internallyStudentized: 0, externallyStudentized: 0, cooksDistance: 0, ...overrides,
  };
}

describe('flag reasons in plain words', () => {
  it('an outlier below the line, by how much in percent', () => {
    const p = point({ y: 207000, fitted: 300000, residual: -93000, externallyStudentized: -3.6, flags: ['unusual', 'outlier'] });
    expect(describeFlags(p, context)).toBe('sold 31% below the line, far outside the scatter of the other sales');
  });

  it('an unusual sale above the line', () => {
    const p = point({ y: 324000, fitted: 300000, residual: 24000, externallyStudentized: 2.3, flags: ['unusual'] });
    expect(describeFlags(p, context)).toBe('sold 8% above the line, more than the scatter of the other sales suggests');
  });

  it('the largest and the smallest floor area, and a lone sale at its own floor area', () => {
    expect(describeFlags(point({ x: 2890, leverage: 0.45, flags: ['high-leverage'] }), context)).toBe(
      'its floor area is the largest in the set',
    );
    expect(describeFlags(point({ x: 1180, leverage: 0.4, flags: ['high-leverage'] }), context)).toBe(
      'its floor area is the smallest in the set',
    );
    expect(describeFlags(point({ x: 2890, leverage: 1, flags: ['high-leverage'] }), context)).toBe(
      'it is the only sale at a different floor area, so the line is forced through it',
    );
  });

  it("influence quotes Cook's distance against the 4/n cut-off", () => {
    const p = point({ cooksDistance: 0.521, flags: ['influential'] });
    expect(describeFlags(p, context)).toBe("leaving it out would move the line noticeably (Cook's distance 0.52, above 0.33)");
  });

  it('joins several reasons, one per flag, and names x in the caller’s words', () => {
    const p = point({
      x: 2890, y: 380000, fitted: 550000, residual: -170000, leverage: 0.5, externallyStudentized: -4.1,
      cooksDistance: 2.4, flags: ['unusual', 'outlier', 'influential', 'high-leverage'],
    });
    expect(flagReasons(p, context).map((r) => r.flag)).toEqual(['unusual', 'outlier', 'influential', 'high-leverage']);
    expect(describeFlags(p, { ...context, xName: 'living area' })).toBe(
      'sold 31% below the line, far outside the scatter of the other sales; ' +
        "leaving it out would move the line noticeably (Cook's distance 2.40, above 0.33); " +
        'its living area is the largest in the set',
    );
  });

  it('falls back to standard errors when a percentage means nothing, and says so when the others fit exactly', () => {
    const negativeFit = point({ fitted: -50, residual: 900, externallyStudentized: 3.4, flags: ['unusual', 'outlier'] });
    expect(describeFlags(negativeFit, context)).toBe('sits 3.4 standard errors above the line, far outside the scatter of the other sales');
    const othersExact = point({ fitted: 0, residual: -5, externallyStudentized: null, flags: ['unusual', 'outlier'] });
    expect(describeFlags(othersExact, context)).toBe(
      'sits below a line that the other sales follow exactly, far outside the scatter of the other sales',
    );
  });

  it('an unflagged sale has no reasons', () => {
    expect(flagReasons(point({ flags: [] }), context)).toEqual([]);
    expect(describeFlags(point({ flags: [] }), context)).toBe('');
  });

  it('works on fitLine output: a sale planted 30% under an otherwise tight line', () => {
    const sales = [1200, 1350, 1500, 1650, 1800, 1950, 2100, 2250, 2400, 2550].map((x, i) => ({
      x, y: 50000 + 150 * x + (i % 2 === 0 ? 1500 : -1500),
    }));
    sales[4] = { x: 1800, y: 0.7 * (50000 + 150 * 1800) };
    const fit = fitLine(sales);
    if (!fit.ok) throw new Error(fit.message);
    const words = describeFlags(fit.points[4], { n: fit.n, xMin: fit.xMin, xMax: fit.xMax });
    expect(words).toMatch(/^sold \d+% below the line, far outside the scatter of the other sales/);
  });
});

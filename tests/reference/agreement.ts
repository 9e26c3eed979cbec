// Two ways of saying "agrees with the source": to a relative tolerance, or to every digit the
// source printed (the printed figure is the true value rounded, so the gap is at most half a unit
// in its last place).
import { expect } from 'vitest';

export function expectRelative(actual: number | null | undefined, expected: number, rel: number, what = ''): void {
  expect(actual, `${what}: got ${actual}`).toBeTypeOf('number');
  const gap = Math.abs((actual as number) - expected);
  expect(gap, `${what}: ${actual} vs ${expected} (relative ${gap / Math.abs(expected)})`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

/** Half a unit in the last printed place of a figure such as "-3.990340", "15.38" or "1.49e-12". */
export function printedHalfUnit(printed: string): number {
  const [mantissa, exponent = '0'] = printed.trim().toLowerCase().split('e');
  const decimals = mantissa.includes('.') ? mantissa.split('.')[1].length : 0;
  return 0.5 * 10 ** (Number(exponent) - decimals);
}

/** `allowance` widens the check for figures that carry a known, separately stated error. */
export function expectPrinted(actual: number | null | undefined, printed: string, what = '', allowance = 0): void {
  expect(actual, `${what}: got ${actual}`).toBeTypeOf('number');
  const expected = Number(printed);
  const gap = Math.abs((actual as number) - expected);
  // 1e-12 of slack only for the binary representation of the printed decimal itself.
  expect(gap, `${what}: ${actual} does not round to ${printed}`).toBeLessThanOrEqual(
    printedHalfUnit(printed) * (1 + 1e-9) + Math.abs(expected) * 1e-12 + allowance,
  );
}

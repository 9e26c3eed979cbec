// Exact rational arithmetic on BigInt, used as an oracle: every binary64 number is a dyadic
// rational, so sums, products and quotients of the inputs can be carried with no rounding at all.

function gcd(a: bigint, b: bigint): bigint {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

function bitLength(v: bigint): number {
  return v === 0n ? 0 : v.toString(2).length;
}

export class Fraction {
  readonly num: bigint;
  readonly den: bigint;

  constructor(num: bigint, den: bigint = 1n) {
    if (den === 0n) throw new RangeError('zero denominator');
    const sign = den < 0n ? -1n : 1n;
    const g = gcd(num, den) || 1n;
    this.num = (sign * num) / g;
    this.den = (sign * den) / g;
  }

  static readonly ZERO = new Fraction(0n);
  static readonly ONE = new Fraction(1n);

  static of(value: number | bigint): Fraction {
    if (typeof value === 'bigint') return new Fraction(value);
    return Fraction.fromNumber(value);
  }

  /** The exact value of a finite double: m · 2^-k with m an integer. */
  static fromNumber(value: number): Fraction {
    if (!Number.isFinite(value)) throw new RangeError(`not finite: ${value}`);
    let scaled = value;
    let k = 0n;
    while (!Number.isInteger(scaled)) {
      scaled *= 2; // exact: only the exponent changes
      k += 1n;
    }
    return new Fraction(BigInt(scaled), 2n ** k);
  }

  add(o: Fraction): Fraction {
    return new Fraction(this.num * o.den + o.num * this.den, this.den * o.den);
  }
  sub(o: Fraction): Fraction {
    return new Fraction(this.num * o.den - o.num * this.den, this.den * o.den);
  }
  mul(o: Fraction): Fraction {
    return new Fraction(this.num * o.num, this.den * o.den);
  }
  div(o: Fraction): Fraction {
    if (o.num === 0n) throw new RangeError('division by zero');
    return new Fraction(this.num * o.den, this.den * o.num);
  }
  neg(): Fraction {
    return new Fraction(-this.num, this.den);
  }
  isZero(): boolean {
    return this.num === 0n;
  }
  sign(): number {
    return this.num === 0n ? 0 : this.num < 0n ? -1 : 1;
  }

  /** Nearest double, to well under one ulp (a 64-bit quotient rounded once by Number()). */
  toNumber(): number {
    if (this.num === 0n) return 0;
    const negative = this.num < 0n;
    const a = negative ? -this.num : this.num;
    const shift = 64 - (bitLength(a) - bitLength(this.den));
    const q = shift >= 0 ? (a << BigInt(shift)) / this.den : a / (this.den << BigInt(-shift));
    const value = Number(q) * 2 ** -shift;
    return negative ? -value : value;
  }
}

export function sumFractions(values: Fraction[]): Fraction {
  return values.reduce((acc, v) => acc.add(v), Fraction.ZERO);
}

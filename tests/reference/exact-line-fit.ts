// An exact-arithmetic straight-line fit, written from the textbook definitions and deliberately by
// other routes than server/analysis/regression.ts, so that agreement means something:
//  - coefficients from the raw normal equations (safe here: nothing is rounded);
//  - leverage from the hat matrix H = X(XᵀX)⁻¹Xᵀ;
//  - Cook's distance from its definition, Σⱼ(ŷⱼ − ŷⱼ₍ᵢ₎)² / (p·s²), by refitting without point i
//    (Cook, R. D. (1977), "Detection of influential observation in linear regression",
//    Technometrics 19(1));
//  - the externally studentized residual as eᵢ / (s₍ᵢ₎·√(1 − hᵢ)) with s₍ᵢ₎ from that refit.
import { Fraction, sumFractions } from './exact-fraction';

export interface ExactLineFit {
  slope: number;
  intercept: number;
  sse: number;
  ssr: number;
  sst: number;
  /** s² = SSE/(n − 2), exact then rounded once. */
  residualVariance: number;
  fitted: number[];
  residuals: number[];
  leverages: number[];
  internallyStudentized: (number | null)[];
  externallyStudentized: (number | null)[];
  cooksDistances: (number | null)[];
  /** Exact s²·(1/n + (x0 − x̄)²/Sxx) and s²·(1 + 1/n + …) at x0, when given. */
  meanVarianceAt?: number;
  newVarianceAt?: number;
}

interface RawLine { a: Fraction; b: Fraction }

/** Solves [n Σx; Σx Σx²]·[a; b] = [Σy; Σxy]. Null when every x is equal. */
function normalEquations(xs: Fraction[], ys: Fraction[]): RawLine | null {
  const n = Fraction.of(xs.length);
  const sx = sumFractions(xs);
  const sy = sumFractions(ys);
  const sxx = sumFractions(xs.map((x) => x.mul(x)));
  const sxy = sumFractions(xs.map((x, i) => x.mul(ys[i])));
  const det = n.mul(sxx).sub(sx.mul(sx));
  if (det.isZero()) return null;
  const b = n.mul(sxy).sub(sx.mul(sy)).div(det);
  const a = sy.sub(b.mul(sx)).div(n);
  return { a, b };
}

const signedSqrt = (square: Fraction, sign: number) => sign * Math.sqrt(square.toNumber());

export function exactLineFit(points: ReadonlyArray<{ x: number; y: number }>, x0?: number): ExactLineFit {
  const xs = points.map((p) => Fraction.fromNumber(p.x));
  const ys = points.map((p) => Fraction.fromNumber(p.y));
  const n = xs.length;
  const p = Fraction.of(2);
  const line = normalEquations(xs, ys);
  if (line === null) throw new Error('exactLineFit needs some spread in x');
  const fitted = xs.map((x) => line.a.add(line.b.mul(x)));
  const residuals = ys.map((y, i) => y.sub(fitted[i]));
  const yMean = sumFractions(ys).div(Fraction.of(n));
  const sse = sumFractions(residuals.map((e) => e.mul(e)));
  const sst = sumFractions(ys.map((y) => y.sub(yMean).mul(y.sub(yMean))));
  const ssr = sumFractions(fitted.map((f) => f.sub(yMean).mul(f.sub(yMean))));
  const s2 = sse.div(Fraction.of(n - 2));

  // Hat matrix diagonal: hᵢ = (1, xᵢ)(XᵀX)⁻¹(1, xᵢ)ᵀ = (Σx² − 2xᵢΣx + n·xᵢ²) / (nΣx² − (Σx)²).
  const sx = sumFractions(xs);
  const sxx = sumFractions(xs.map((x) => x.mul(x)));
  const det = Fraction.of(n).mul(sxx).sub(sx.mul(sx));
  const leverages = xs.map((x) => sxx.sub(Fraction.of(2).mul(x).mul(sx)).add(Fraction.of(n).mul(x).mul(x)).div(det));

  const internal: (number | null)[] = [];
  const external: (number | null)[] = [];
  const cooks: (number | null)[] = [];
  residuals.forEach((e, i) => {
    const oneMinusH = Fraction.ONE.sub(leverages[i]);
    const others = normalEquations(xs.filter((_, j) => j !== i), ys.filter((_, j) => j !== i));
    if (oneMinusH.isZero() || others === null || s2.isZero()) {
      internal.push(null);
      external.push(null);
      cooks.push(null);
      return;
    }
    internal.push(signedSqrt(e.mul(e).div(s2.mul(oneMinusH)), e.sign()));
    const shifts = xs.map((x, j) => fitted[j].sub(others.a.add(others.b.mul(x))));
    cooks.push(sumFractions(shifts.map((d) => d.mul(d))).div(p.mul(s2)).toNumber());
    const deletedSse = sumFractions(
      xs.map((x, j) => (j === i ? Fraction.ZERO : ys[j].sub(others.a.add(others.b.mul(x))))).map((d) => d.mul(d)),
    );
    if (n - 3 === 0 || deletedSse.isZero()) {
      external.push(null);
      return;
    }
    const deletedS2 = deletedSse.div(Fraction.of(n - 3));
    external.push(signedSqrt(e.mul(e).div(deletedS2.mul(oneMinusH)), e.sign()));
  });

  const result: ExactLineFit = {
    slope: line.b.toNumber(),
    intercept: line.a.toNumber(),
    sse: sse.toNumber(),
    ssr: ssr.toNumber(),
    sst: sst.toNumber(),
    residualVariance: s2.toNumber(),
    fitted: fitted.map((f) => f.toNumber()),
    residuals: residuals.map((e) => e.toNumber()),
    leverages: leverages.map((h) => h.toNumber()),
    internallyStudentized: internal,
    externallyStudentized: external,
    cooksDistances: cooks,
  };
  if (x0 !== undefined) {
    const xMean = sx.div(Fraction.of(n));
    const d0 = Fraction.fromNumber(x0).sub(xMean);
    const centredSxx = sumFractions(xs.map((x) => x.sub(xMean).mul(x.sub(xMean))));
    const meanFactor = Fraction.ONE.div(Fraction.of(n)).add(d0.mul(d0).div(centredSxx));
    result.meanVarianceAt = s2.mul(meanFactor).toNumber();
    result.newVarianceAt = s2.mul(Fraction.ONE.add(meanFactor)).toNumber();
  }
  return result;
}

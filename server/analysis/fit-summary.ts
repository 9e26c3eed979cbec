import type { FitSummary } from '../contracts/analysis';
import type { LineFitOk } from './regression';

/** The figures of a fit without its per-point rows (those travel separately, keyed by sale). */
export function summariseFit(fit: LineFitOk): FitSummary {
  return {
    n: fit.n,
    slope: fit.slope,
    intercept: fit.intercept,
    r: fit.r,
    rSquared: fit.rSquared,
    adjustedRSquared: fit.adjustedRSquared,
    sst: fit.sst,
    ssr: fit.ssr,
    sse: fit.sse,
    residualStdError: fit.residualStdError,
    slopeStdError: fit.slopeStdError,
    interceptStdError: fit.interceptStdError,
    slopeTStat: fit.slopeTStat,
    slopePValue: fit.slopePValue,
    slopeInterval: fit.slopeInterval,
    tCritical: fit.tCritical,
    xMean: fit.xMean,
    yMean: fit.yMean,
    xMin: fit.xMin,
    xMax: fit.xMax,
  };
}

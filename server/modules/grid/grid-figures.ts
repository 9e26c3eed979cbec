import type { GroupAnalysis } from '../../contracts/analysis';
import type { GridResponse } from '../../contracts/grid';
import type { GridResult } from '../../analysis/adjustment-grid';

/** The grid's computed figures as the grid answer carries them (empty until there is a grid), with
 * the regression estimate of the subject's neighbourhood beside them for the cross-check. */
export function gridFigures(grid: GridResult | null, group: GroupAnalysis | null) {
  const prediction = group?.prediction ?? null;
  return {
    rows: grid?.rows ?? [],
    weightsTotalPct: grid?.weightsTotalPct ?? 0,
    indicatedValue: grid?.indicatedValue ?? null,
    opinionOfValue: grid?.opinionOfValue ?? null,
    adjustedRange: grid?.adjustedRange ?? null,
    regression: prediction && group ? { estimate: prediction.estimate, lower: prediction.lower, upper: prediction.upper, neighbourhood: group.neighbourhood } : null,
    checks: grid?.checks ?? [],
  } satisfies Partial<GridResponse>;
}

// Plain words for the flags that fitLine puts on a point, e.g.
// "sold 31% below the line; its floor area is the largest in the set".
// A flag is a question for the appraiser, not a verdict, so the words describe, never judge.
import type { FitPoint, PointFlag } from './regression';

export interface FlagReasonContext {
  n: number;
  xMin: number;
  xMax: number;
  /** What x measures, in the appraiser's words. Default "floor area". */
  xName?: string;
}

export interface FlagReason {
  flag: PointFlag;
  reason: string;
}

/** Where the point sits against the line, as a percentage of the fitted price when that makes sense. */
function offTheLine(point: FitPoint): string {
  const direction = point.residual < 0 ? 'below' : 'above';
  const percent = point.fitted > 0 ? Math.round((Math.abs(point.residual) / point.fitted) * 100) : 0;
  if (percent >= 1) return `sold ${percent}% ${direction} the line`;
  if (point.externallyStudentized !== null) {
    return `sits ${Math.abs(point.externallyStudentized).toFixed(1)} standard errors ${direction} the line`;
  }
  return `sits ${direction} a line that the other sales follow exactly`;
}

function leverageReason(point: FitPoint, context: FlagReasonContext): string {
  const xName = context.xName ?? 'floor area';
  if (point.leverage === 1) return `it is the only sale at a different ${xName}, so the line is forced through it`;
  if (point.x === context.xMax) return `its ${xName} is the largest in the set`;
  if (point.x === context.xMin) return `its ${xName} is the smallest in the set`;
  return `its ${xName} is far from that of most other sales`;
}

function influenceReason(point: FitPoint, context: FlagReasonContext): string {
  const cooks = point.cooksDistance ?? 0;
  return `leaving it out would move the line noticeably (Cook's distance ${cooks.toFixed(2)}, above ${(4 / context.n).toFixed(2)})`;
}

/** One reason per flag, in the order the flags appear on the point. */
export function flagReasons(point: FitPoint, context: FlagReasonContext): FlagReason[] {
  return point.flags.map((flag) => {
    switch (flag) {
      case 'outlier':
        return { flag, reason: `${offTheLine(point)}, far outside the scatter of the other sales` };
      case 'unusual':
        return { flag, reason: `${offTheLine(point)}, more than the scatter of the other sales suggests` };
      case 'influential':
        return { flag, reason: influenceReason(point, context) };
      case 'high-leverage':
        return { flag, reason: leverageReason(point, context) };
    }
  });
}

/** All reasons in one sentence fragment; an outlier's reason replaces the milder "unusual" one. */
export function describeFlags(point: FitPoint, context: FlagReasonContext): string {
  const reasons = flagReasons(point, context);
  const isOutlier = point.flags.includes('outlier');
  return reasons
    .filter((r) => !(isOutlier && r.flag === 'unusual'))
    .map((r) => r.reason)
    .join('; ');
}

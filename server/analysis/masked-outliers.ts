// One gross outlier can drag the line towards itself and hide others (the masking effect described
// by Hadi & Simonoff, JASA 88 (1993) 1264–1272). After the full fit, this sets aside the single most
// extreme outlier, refits, and repeats while an outlier remains: each sale that stands out only
// after others were set aside is reported with those sales and with the refit's own figures. It adds
// questions; it never changes the fit.
//
// The refits run on the scratch columns of fit-columns.ts: only the one revealed point of a round
// becomes an object.
import { fitColumns, fitScratch } from './fit-columns';
import { HAS_EXTERNAL, OUTLIER_T, pointAt } from './point-diagnostics';
import type { FitPoint } from './regression';

const MAX_ROUNDS = 6;

export interface RevealedOutlier {
  index: number;
  /** The point as the refit (without the set-aside sales) sees it. */
  point: FitPoint;
  setAside: number[];
}

/**
 * `fullFit`, when given, is fitLine(points).points: the first round's fit is then not repeated.
 * It must be the fit of exactly these points.
 */
export function revealMaskedOutliers(
  points: ReadonlyArray<{ x: number; y: number }>,
  firstPass: readonly number[],
  fullFit?: ReadonlyArray<{ externallyStudentized: number | null }>,
): RevealedOutlier[] {
  if (firstPass.length === 0) return [];
  const alreadyFlagged = new Set(firstPass);
  const setAside: number[] = [];
  const revealed: RevealedOutlier[] = [];
  const isSetAside = new Uint8Array(points.length);
  const kept = new Int32Array(points.length);
  for (let round = 0; round < MAX_ROUNDS; round++) {
    let worstIndex = -1;
    let worstT = 0;
    if (round === 0 && fullFit) {
      for (let i = 0; i < fullFit.length; i++) {
        const t = Math.abs(fullFit[i].externallyStudentized ?? 0);
        if (t > OUTLIER_T && (worstIndex < 0 || t > worstT)) {
          worstIndex = i;
          worstT = t;
        }
      }
      if (worstIndex < 0) break;
      setAside.push(worstIndex);
      isSetAside[worstIndex] = 1;
      continue;
    }
    let n = 0;
    const { xs, ys } = fitScratch(points.length);
    let bad = -1;
    for (let i = 0; i < points.length; i++) {
      if (isSetAside[i]) continue;
      const { x, y } = points[i];
      if (bad < 0 && !(Number.isFinite(x) && Number.isFinite(y))) bad = n;
      xs[n] = x;
      ys[n] = y;
      kept[n++] = i;
    }
    const fit = fitColumns(n, bad);
    if (!fit.ok) break;
    const { residuals, points: columns } = fitScratch(n);
    let worstK = -1;
    for (let k = 0; k < n; k++) {
      const t = columns.state[k] & HAS_EXTERNAL ? Math.abs(columns.external[k]) : 0;
      if (t > OUTLIER_T && (worstK < 0 || t > worstT)) {
        worstK = k;
        worstT = t;
      }
    }
    if (worstK < 0) break;
    worstIndex = kept[worstK];
    if (round > 0 && !alreadyFlagged.has(worstIndex)) {
      revealed.push({ index: worstIndex, point: pointAt(xs, ys, residuals, columns, worstK), setAside: [...setAside] });
    }
    setAside.push(worstIndex);
    isSetAside[worstIndex] = 1;
  }
  return revealed;
}

// One gross outlier can drag the line towards itself and hide others (the masking effect described
// by Hadi & Simonoff, JASA 88 (1993) 1264–1272). After the full fit, this sets aside the sales
// flagged as outliers, refits, and repeats while new outliers appear: each sale revealed that way is
// reported with the sales that had to be set aside. It adds questions; it never changes the fit.
import { fitLine, type FitPoint } from './regression';

export const OUTLIER_T = 3;
const MAX_ROUNDS = 5;

export interface RevealedOutlier {
  index: number;
  point: FitPoint;
  setAside: number[];
}

/** Indexes into `points`; `firstPass` are the points the full fit already flags as outliers. */
export function revealMaskedOutliers(points: ReadonlyArray<{ x: number; y: number }>, firstPass: readonly number[]): RevealedOutlier[] {
  const setAside = new Set(firstPass);
  const revealed: RevealedOutlier[] = [];
  for (let round = 0; round < MAX_ROUNDS && setAside.size > 0; round++) {
    const kept = points.map((_, i) => i).filter((i) => !setAside.has(i));
    const fit = fitLine(kept.map((i) => points[i]));
    if (!fit.ok) break;
    const before = [...setAside];
    const fresh = fit.points
      .map((p, k) => ({ p, index: kept[k] }))
      .filter(({ p }) => p.externallyStudentized !== null && Math.abs(p.externallyStudentized) > OUTLIER_T);
    if (fresh.length === 0) break;
    for (const { p, index } of fresh) {
      setAside.add(index);
      revealed.push({ index, point: p, setAside: before });
    }
  }
  return revealed;
}

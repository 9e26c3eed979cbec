// One gross outlier can drag the line towards itself and hide others (the masking effect described
// by Hadi & Simonoff, JASA 88 (1993) 1264–1272). After the full fit, this sets aside the single most
// extreme outlier, refits, and repeats while an outlier remains: each sale that stands out only
// after others were set aside is reported with those sales and with the refit's own figures. It adds
// questions; it never changes the fit.
import { fitLine, type FitPoint } from './regression';

export const OUTLIER_T = 3;
const MAX_ROUNDS = 6;

export interface RevealedOutlier {
  index: number;
  /** The point as the refit (without the set-aside sales) sees it. */
  point: FitPoint;
  setAside: number[];
}

export function revealMaskedOutliers(points: ReadonlyArray<{ x: number; y: number }>, firstPass: readonly number[]): RevealedOutlier[] {
  if (firstPass.length === 0) return [];
  const alreadyFlagged = new Set(firstPass);
  const setAside: number[] = [];
  const revealed: RevealedOutlier[] = [];
  for (let round = 0; round < MAX_ROUNDS; round++) {
    const kept = points.map((_, i) => i).filter((i) => !setAside.includes(i));
    const fit = fitLine(kept.map((i) => points[i]));
    if (!fit.ok) break;
    let worst: { p: FitPoint; index: number } | null = null;
    for (const [k, p] of fit.points.entries()) {
      const t = Math.abs(p.externallyStudentized ?? 0);
      if (t > OUTLIER_T && (!worst || t > Math.abs(worst.p.externallyStudentized ?? 0))) worst = { p, index: kept[k] };
    }
    if (!worst) break;
    if (round > 0 && !alreadyFlagged.has(worst.index)) revealed.push({ index: worst.index, point: worst.p, setAside: [...setAside] });
    setAside.push(worst.index);
  }
  return revealed;
}

import { pointFlagWords, type FlaggedSale, type GroupAnalysis } from '@contracts/analysis';

export type Flag = FlaggedSale['flags'][number];

/** What each flag means, for the badge's title. */
export const flagMeanings: Record<Flag, string> = {
  unusual: 'Its externally studentized residual is beyond ±2.',
  outlier: 'Its externally studentized residual is beyond ±3, or it stands out once other outliers are set aside.',
  influential: 'Its Cook’s distance is above 4/n: leaving it out would move the line.',
  'high-leverage': 'Its leverage is above 4/n: its floor area is far from the others’.',
};

/** The flags of each flagged sale of a group (the flagged list is the one source: it also holds
 * sales that stood out only once others were set aside). */
export function flagsBySale(group: GroupAnalysis): ReadonlyMap<number, readonly Flag[]> {
  return new Map(group.flagged.map((f) => [f.saleId, f.flags]));
}

export function describeFlags(flags: readonly Flag[]): string {
  return flags.map((f) => pointFlagWords[f]).join(', ');
}

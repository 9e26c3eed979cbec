/**
 * The diverging residual scale of the map and the table: teal below the fitted line, grey on it,
 * rust above it, in three strengths each. The measure is the externally studentized residual, so
 * the same colour means the same surprise in every neighbourhood.
 */
export type ResidualBand = 'none' | 'low-strong' | 'low' | 'low-soft' | 'mid' | 'high-soft' | 'high' | 'high-strong';

export function residualBand(studentized: number | null | undefined): ResidualBand {
  if (studentized == null || !Number.isFinite(studentized)) return 'none';
  const size = Math.abs(studentized);
  if (size < 0.5) return 'mid';
  const side = studentized < 0 ? 'low' : 'high';
  if (size >= 2) return `${side}-strong`;
  if (size >= 1) return side;
  return `${side}-soft`;
}

export const residualBandWords: Record<ResidualBand, string> = {
  none: 'no fit yet',
  'low-strong': 'far below the line',
  low: 'below the line',
  'low-soft': 'a little below the line',
  mid: 'on the line',
  'high-soft': 'a little above the line',
  high: 'above the line',
  'high-strong': 'far above the line',
};

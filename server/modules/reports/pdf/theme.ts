// Compline's paper-and-ink palette as printed: white paper (the warm ground is for screens), deep
// ink-blue text, one ochre accent, teal–grey–rust for residuals and a magenta ring for flagged sales.

export const INK = {
  ink: '#1d2a44',
  soft: '#47536c',
  faint: '#7b8293',
  rule: '#e0d7c6',
  ruleStrong: '#bfb199',
  tint: '#fbf8f2',
  tintStrong: '#f3ede1',
} as const;

export const ACCENT = { ochre: '#c8891c', ochreDeep: '#a8700f', ochreWash: '#f5e7c9' } as const;

export const STATE = { teal: '#1d6a66', tealWash: '#dcebe6', rust: '#a3452a', rustWash: '#f6e1d7' } as const;

/** Teal below the fitted line, grey near it, rust above it: the same steps as on screen. */
export const RESIDUAL_STEPS = ['#0f5a57', '#3f8984', '#9cc3bd', '#a7a59e', '#e0ad92', '#c0683f', '#92361a'] as const;

export const FLAG_RING = '#c2237f';

/** US Letter in points, with room above for the running head and below for the footer. */
export const PAGE = {
  width: 612,
  height: 792,
  left: 54,
  right: 54,
  top: 74,
  bottom: 70,
} as const;
export const CONTENT_WIDTH = PAGE.width - PAGE.left - PAGE.right;

/** The colour step of a residual measured in residual standard errors (s). */
export function residualColour(residual: number, s: number): string {
  if (!(s > 0) || !Number.isFinite(residual)) return RESIDUAL_STEPS[3];
  const z = residual / s;
  if (z <= -2) return RESIDUAL_STEPS[0];
  if (z <= -1) return RESIDUAL_STEPS[1];
  if (z <= -0.5) return RESIDUAL_STEPS[2];
  if (z < 0.5) return RESIDUAL_STEPS[3];
  if (z < 1) return RESIDUAL_STEPS[4];
  if (z < 2) return RESIDUAL_STEPS[5];
  return RESIDUAL_STEPS[6];
}

/**
 * The diverging scale for residuals: teal for sales below the line, grey near it, rust above it.
 * Steps are on the externally studentized residual, so that one scale serves every neighbourhood.
 */
export interface ResidualStep {
  /** The step holds values up to this bound (the last step is open). */
  below: number;
  colour: string;
  label: string;
}

export const residualSteps: readonly ResidualStep[] = [
  { below: -2, colour: 'var(--color-residual-low-strong)', label: 'more than 2 below' },
  { below: -1, colour: 'var(--color-residual-low)', label: '1 to 2 below' },
  { below: -0.5, colour: 'var(--color-residual-low-soft)', label: '½ to 1 below' },
  { below: 0.5, colour: 'var(--color-residual-mid)', label: 'within ½ of the line' },
  { below: 1, colour: 'var(--color-residual-high-soft)', label: '½ to 1 above' },
  { below: 2, colour: 'var(--color-residual-high)', label: '1 to 2 above' },
  { below: Infinity, colour: 'var(--color-residual-high-strong)', label: 'more than 2 above' },
];

/** The bounds printed under the legend's swatches. */
export const residualBounds = [-2, -1, -0.5, 0.5, 1, 2] as const;

/** The colour of a sale's mark; grey when its studentized residual is not defined. */
export function residualColour(studentized: number | null): string {
  if (studentized === null || !Number.isFinite(studentized)) return 'var(--color-residual-mid)';
  return (residualSteps.find((step) => studentized < step.below) ?? residualSteps[residualSteps.length - 1]).colour;
}

/** The diverging residual scale: teal below the line, grey on it, rust above (by how many
 * standard errors the sale lies off the line, externally studentized). */
export function residualColour(studentized: number | null | undefined): string {
  if (typeof studentized !== 'number' || !Number.isFinite(studentized)) return 'var(--color-residual-mid)';
  const z = studentized;
  if (z <= -2) return 'var(--color-residual-low-strong)';
  if (z <= -1) return 'var(--color-residual-low)';
  if (z <= -0.5) return 'var(--color-residual-low-soft)';
  if (z < 0.5) return 'var(--color-residual-mid)';
  if (z < 1) return 'var(--color-residual-high-soft)';
  if (z < 2) return 'var(--color-residual-high)';
  return 'var(--color-residual-high-strong)';
}

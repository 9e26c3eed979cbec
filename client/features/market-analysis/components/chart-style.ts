/** The drawing style the analysis charts share: ink on paper, figures in the mono face. */
export const gridStroke = 'var(--color-rule)';
export const axisLine = { stroke: 'var(--color-rule-strong)' };
export const axisTick = { fill: 'var(--color-ink-soft)', fontSize: 11.5, fontFamily: 'var(--font-mono)' };
export const axisLabel = { fill: 'var(--color-ink-faint)', fontSize: 12, fontFamily: 'var(--font-sans)' };

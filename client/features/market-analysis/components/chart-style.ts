import type { AxisDomain } from '../lib/axis-domain';

/** The drawing style the analysis charts share: ink on paper, figures in the mono face. */
export const gridStroke = 'var(--color-rule)';
export const axisLine = { stroke: 'var(--color-rule-strong)' };
export const axisTick = { fill: 'var(--color-ink-soft)', fontSize: 11.5, fontFamily: 'var(--font-mono)' };
export const axisLabel = { fill: 'var(--color-ink-faint)', fontSize: 12, fontFamily: 'var(--font-sans)' };

interface AxisOptions {
  scale: AxisDomain;
  format: (value: number) => string;
  label: string;
}

/** What every value axis of the analysis charts shares: numbers from the point's x or y, the round
 * ticks of niceDomain, points beyond the range clipped rather than stretching it. */
function valueAxis({ scale, format, label }: AxisOptions) {
  return {
    type: 'number' as const,
    domain: scale.domain,
    ticks: scale.ticks,
    allowDataOverflow: true,
    tickFormatter: format,
    tick: axisTick,
    axisLine,
    tickLine: axisLine,
    label: { ...axisLabel, value: label },
  };
}

/** Props for <XAxis>: the point's x, the label under the axis. */
export function xAxisProps(options: AxisOptions) {
  const axis = valueAxis(options);
  return { ...axis, dataKey: 'x', label: { ...axis.label, position: 'insideBottom' as const, offset: -18 } };
}

/** Props for <YAxis>: the point's y, the label turned along the axis. */
export function yAxisProps(options: AxisOptions) {
  const axis = valueAxis(options);
  return { ...axis, dataKey: 'y', width: 72, label: { ...axis.label, angle: -90, position: 'insideLeft' as const, offset: 2, style: { textAnchor: 'middle' as const } } };
}

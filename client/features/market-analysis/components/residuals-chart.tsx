import { CartesianGrid, DefaultZIndexes, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZIndexLayer } from 'recharts';
import { niceDomain } from '../lib/axis-domain';
import { inRange } from '../lib/focus-range';
import { describeFlags } from '../lib/flag-words';
import { DenseSaleMarks, SaleMark, splitDense, type FittedSalePoint, type GroupChartProps } from './chart-marks';
import { axisLabel, gridStroke, xAxisProps, yAxisProps } from './chart-style';
import { SaleTooltip } from './sale-tooltip';

type ResidualPoint = FittedSalePoint;

/** Residuals against fitted values, with the zero line and guides at two residual standard
 * errors either side: a pattern here (a funnel, a curve) is a question for the appraiser. */
export function ResidualsChart({ group, flagsById, format, lookup, onOpen, focus, height }: GroupChartProps) {
  const s = group.fit.residualStdError;
  // x is the fitted price, y the residual: the same sale, seen from the line.
  const points: ResidualPoint[] = group.points.filter((p) => inRange(focus, p.x)).map((p) => ({
    saleId: p.saleId,
    x: p.fitted,
    y: p.residual,
    residual: p.residual,
    studentized: p.externallyStudentized,
    flagged: flagsById.has(p.saleId),
    flags: flagsById.get(p.saleId) ?? [],
  }));
  const x = niceDomain(points.map((p) => p.x), 5);
  const y = niceDomain([...points.map((p) => p.y), 2 * s, -2 * s, 0], 5);
  const { marks, dense } = splitDense(points);

  return (
    <ResponsiveContainer width="100%" height={height}>
      <ScatterChart margin={{ top: 10, right: 16, bottom: 30, left: 4 }}>
        <CartesianGrid stroke={gridStroke} vertical={false} />
        <XAxis {...xAxisProps({ scale: x, format: (v) => format.compactMoney(v), label: 'Fitted price' })} />
        <YAxis {...yAxisProps({ scale: y, format: (v) => format.compactMoney(v), label: 'Residual' })} />
        {s > 0 && <ReferenceLine y={2 * s} stroke="var(--color-ink-faint)" strokeDasharray="4 4" label={{ value: '+2s', position: 'insideTopRight', ...axisLabel, fontSize: 11 }} />}
        {s > 0 && <ReferenceLine y={-2 * s} stroke="var(--color-ink-faint)" strokeDasharray="4 4" label={{ value: '−2s', position: 'insideBottomRight', ...axisLabel, fontSize: 11 }} />}
        <ReferenceLine y={0} stroke="var(--color-ink)" strokeWidth={1.5} />
        <ZIndexLayer zIndex={DefaultZIndexes.scatter - 1}>
          <DenseSaleMarks points={dense} radius={2.5} />
        </ZIndexLayer>
        <Scatter data={marks} isAnimationActive={false} shape={(props: object) => <SaleMark {...props} radius={4} onOpen={onOpen} />} />
        <Tooltip
          cursor={false}
          isAnimationActive={false}
          content={(props) => (
            <SaleTooltip<ResidualPoint>
              active={props.active}
              payload={props.payload}
              title={(d) => lookup(d.saleId).address}
              rows={(d) => [
                ['Fitted price', format.money(d.x)],
                ['Residual', format.signedMoney(d.residual)],
                ['Studentized', format.signedRatio(d.studentized)],
              ]}
              note={(d) => (d.flagged ? `Flagged: ${describeFlags(d.flags)}.` : null)}
            />
          )}
        />
      </ScatterChart>
    </ResponsiveContainer>
  );
}

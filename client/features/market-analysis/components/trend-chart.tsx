import { CartesianGrid, DefaultZIndexes, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZIndexLayer } from 'recharts';
import type { FitSummary, Trend } from '@contracts/analysis';
import { niceDomain } from '../lib/axis-domain';
import type { FigureFormat } from '../lib/figure-format';
import { predictionBand } from '../lib/prediction-band';
import type { SaleLookup } from '../lib/sale-lookup';
import { DenseSaleMarks, FitLayer, SaleMark, splitDense, type SalePoint } from './chart-marks';
import { gridStroke, xAxisProps, yAxisProps } from './chart-style';
import { SaleTooltip } from './sale-tooltip';

interface Props {
  trend: Trend & { fit: FitSummary };
  flaggedIds: ReadonlySet<number>;
  format: FigureFormat;
  lookup: SaleLookup;
  onOpen: (saleId: number) => void;
  height: number;
}

/** Price per unit area against months before the effective date, oldest sales on the left, with
 * the fitted trend line. */
export function TrendChart({ trend, flaggedIds, format, lookup, onOpen, height }: Props) {
  const points: SalePoint[] = trend.points.map((p) => ({
    saleId: p.saleId,
    x: p.monthsBefore,
    y: p.pricePerArea,
    studentized: null,
    flagged: flaggedIds.has(p.saleId),
  }));
  const x = niceDomain([0, ...points.map((p) => p.x)], 6, 0);
  const line = predictionBand(trend.fit, trend.fit.xMin, trend.fit.xMax, 2);
  const y = niceDomain([...points.map((p) => p.y), ...line.map((p) => p.fitted)], 5);
  const { marks, dense } = splitDense(points);

  return (
    <ResponsiveContainer width="100%" height={height}>
      <ScatterChart margin={{ top: 10, right: 16, bottom: 30, left: 4 }}>
        <CartesianGrid stroke={gridStroke} vertical={false} />
        <XAxis
          reversed
          {...xAxisProps({
            scale: { domain: [Math.max(0, x.domain[0]), x.domain[1]], ticks: x.ticks.filter((t) => t >= 0) },
            format: (v) => format.count(v),
            label: 'Months before the effective date',
          })}
        />
        <YAxis {...yAxisProps({ scale: y, format: (v) => format.compactMoney(v), label: `Price per ${format.unit}` })} />
        <ZIndexLayer zIndex={DefaultZIndexes.area}>
          <FitLayer band={line} showBand={false} />
        </ZIndexLayer>
        <ZIndexLayer zIndex={DefaultZIndexes.scatter - 1}>
          <DenseSaleMarks points={dense} radius={2.5} fill="var(--color-ink-soft)" />
        </ZIndexLayer>
        <Scatter
          data={marks}
          isAnimationActive={false}
          shape={(props: object) => <SaleMark {...props} radius={3.5} fill="var(--color-ink-soft)" onOpen={onOpen} />}
        />
        <Tooltip
          cursor={false}
          isAnimationActive={false}
          content={(props) => (
            <SaleTooltip<SalePoint>
              active={props.active}
              payload={props.payload}
              title={(d) => lookup(d.saleId).address}
              rows={(d) => [
                [`Price per ${format.unit}`, format.rateAmount(d.y)],
                ['Sold', `${format.months(d.x)} before`],
              ]}
              note={(d) => (d.flagged ? 'Flagged in the floor-area fit.' : null)}
            />
          )}
        />
      </ScatterChart>
    </ResponsiveContainer>
  );
}

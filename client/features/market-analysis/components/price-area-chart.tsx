import { CartesianGrid, DefaultZIndexes, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZIndexLayer } from 'recharts';
import { niceDomain } from '../lib/axis-domain';
import { describeFlags } from '../lib/flag-words';
import { predictionBand, predictionHalfWidth, fittedAt } from '../lib/prediction-band';
import { DenseSaleMarks, FitLayer, OffScaleMarks, SaleMark, splitDense, SubjectMark, type FittedSalePoint, type GroupChartProps } from './chart-marks';
import { inRange } from '../lib/focus-range';
import { SaleTooltip } from './sale-tooltip';
import { gridStroke, xAxisProps, yAxisProps } from './chart-style';

interface PricePoint extends FittedSalePoint {
  fitted: number;
}

interface Props extends GroupChartProps {
  timeAdjusted: boolean;
}

/** Price against floor area: the sales coloured by residual, flagged ones ringed, the fitted line,
 * its 95% prediction band and, where the group has one, the subject with its prediction interval. */
export function PriceAreaChart({ group, flagsById, format, lookup, timeAdjusted, onOpen, focus, height }: Props) {
  const { fit, prediction } = group;
  const points: PricePoint[] = group.points.map((p) => ({
    saleId: p.saleId,
    x: p.x,
    y: p.y,
    fitted: p.fitted,
    residual: p.residual,
    studentized: p.externallyStudentized,
    flagged: flagsById.has(p.saleId),
    flags: flagsById.get(p.saleId) ?? [],
  }));

  const shown = points.filter((p) => inRange(focus, p.x));
  const offScale = points.filter((p) => !inRange(focus, p.x));
  const areas = shown.map((p) => p.x);
  const x = niceDomain([...areas, ...(prediction ? [prediction.x0] : [])], 6);
  const band = predictionBand(fit, x.domain[0], x.domain[1]);
  // The band at the ends of the sales shown (not of the axis) sets the price range, so that a
  // wide band far from the sales does not squeeze them.
  const bandEnds = [Math.min(...areas), Math.max(...areas)].flatMap((at) => {
    const half = predictionHalfWidth(fit, at);
    return half === null ? [] : [fittedAt(fit, at) - half, fittedAt(fit, at) + half];
  });
  // Prices are positive: a band reaching below zero is cut at the axis rather than stretching it.
  const floor = shown.every((p) => p.y >= 0) ? 0 : -Infinity;
  const yValues = [...shown.map((p) => p.y), ...bandEnds, ...(prediction ? [prediction.lower, prediction.upper] : [])].map((v) => Math.max(floor, v));
  const y = niceDomain(yValues, 8, 0.03, floor);
  const { marks, dense } = splitDense(shown);

  return (
    <ResponsiveContainer width="100%" height={height}>
      <ScatterChart margin={{ top: 16, right: 28, bottom: 30, left: 4 }}>
        <CartesianGrid stroke={gridStroke} vertical={false} />
        <XAxis {...xAxisProps({ scale: x, format: (v) => format.areaNumber(v), label: `Floor area (${format.unit})` })} />
        <YAxis {...yAxisProps({ scale: y, format: (v) => format.compactMoney(v), label: timeAdjusted ? 'Time-adjusted price' : 'Sale price' })} />
        <ZIndexLayer zIndex={DefaultZIndexes.area}>
          <FitLayer band={band} />
        </ZIndexLayer>
        <ZIndexLayer zIndex={DefaultZIndexes.scatter - 1}>
          <DenseSaleMarks points={dense} radius={3} />
        </ZIndexLayer>
        <Scatter
          data={marks}
          isAnimationActive={false}
          shape={(props: object) => <SaleMark {...props} radius={5} onOpen={onOpen} />}
        />
        <ZIndexLayer zIndex={DefaultZIndexes.scatter}>
          <OffScaleMarks points={offScale} label={(p) => format.area(p.x)} onOpen={onOpen} />
        </ZIndexLayer>
        {prediction && (
          <ZIndexLayer zIndex={DefaultZIndexes.scatter + 50}>
            <SubjectMark x0={prediction.x0} estimate={prediction.estimate} lower={prediction.lower} upper={prediction.upper} />
          </ZIndexLayer>
        )}
        <Tooltip
          cursor={false}
          isAnimationActive={false}
          content={(props) => (
            <SaleTooltip<PricePoint>
              active={props.active}
              payload={props.payload}
              title={(d) => lookup(d.saleId).address}
              rows={(d) => {
                const sold = lookup(d.saleId).salePrice;
                return [
                  [timeAdjusted ? 'Time-adjusted price' : 'Sale price', format.money(d.y)],
                  ...(timeAdjusted && sold !== null ? ([['Sold for', format.money(sold)]] as [string, string][]) : []),
                  ['Floor area', format.area(d.x)],
                  ['Residual', `${format.signedMoney(d.residual)} (${format.signedPercent(d.fitted > 0 ? d.residual / d.fitted : null)})`],
                  ['Studentized', format.signedRatio(d.studentized)],
                ];
              }}
              note={(d) => (d.flagged ? `Flagged: ${describeFlags(d.flags)}.` : null)}
            />
          )}
        />
      </ScatterChart>
    </ResponsiveContainer>
  );
}

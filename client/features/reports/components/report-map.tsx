import { useQuery } from '@tanstack/react-query';
import type { ReportSnapshot } from '@contracts/report';
import { reportQueries } from '../api/report-queries';
import { gridSales, handledSales } from '@contracts/report-facts';
import { boundsOf } from '../../../lib/geo-bounds';
import { fitProjection, labelPoint, pathOf, scaleBar, type BasemapFeature } from '../lib/map-projection';
import { residualColour } from '../lib/residual-colour';
import { MapLegend } from './map-legend';

const WIDTH = 880;
const HEIGHT = 520;

/**
 * A still map of the subject and the sales as they were signed, drawn from the snapshot's
 * coordinates over the town's neighbourhood boundaries (static GeoJSON shipped with the app). It
 * prints as it shows: no tiles, no scripts, no network beyond the basemap files.
 */
export function ReportMap({ snapshot }: { snapshot: ReportSnapshot }) {
  const neighbourhoods = useQuery(reportQueries.basemap('neighbourhoods'));
  const coast = useQuery(reportQueries.basemap('coast'));
  const streets = useQuery(reportQueries.basemap('streets'));

  const { subject } = snapshot;
  const located = snapshot.sales.filter((s) => s.lon !== null && s.lat !== null);
  const studentized = new Map(snapshot.analysis.groups.filter((g) => !g.pooled).flatMap((g) => g.points.map((p) => [p.saleId, p.externallyStudentized] as const)));
  const flagged = new Set(handledSales(snapshot).filter((h) => h.flags.length > 0).map((h) => h.saleId));
  const letters = new Map(gridSales(snapshot).map((g) => [g.sale.id, g.label]));
  const hoods = neighbourhoods.data?.features ?? [];

  const positions = [
    ...located.map((s) => [s.lon!, s.lat!]),
    ...(subject.lon !== null && subject.lat !== null ? [[subject.lon, subject.lat]] : []),
    ...hoods.flatMap((f) => (f.geometry.type === 'Polygon' ? f.geometry.coordinates[0] : [])),
  ];
  const bounds = boundsOf(positions);
  if (!bounds) return <p className="rounded-lg border border-dashed border-rule-strong px-5 py-8 text-center text-ink-soft">Neither the subject nor any sale has a location, so there is no map.</p>;
  const projection = fitProjection(bounds, WIDTH, HEIGHT);
  const at = (lon: number, lat: number) => projection.point(lon, lat);
  const bar = scaleBar(projection, 140);
  const layer = (features: readonly BasemapFeature[] | undefined, kind: string) => (features ?? []).filter((f) => f.properties.kind === kind);
  const unlocated = snapshot.sales.length - located.length;
  const drawOrder = [...located].sort((a, b) => Number(letters.has(a.id)) - Number(letters.has(b.id)));

  return (
    <figure className="flex flex-col gap-3">
      <svg
        viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
        role="img"
        aria-label={`Map of the subject and ${located.length} sales over the neighbourhood boundaries`}
        className="report-map block h-auto w-full rounded-lg border border-rule bg-paper-sunk"
      >
        <defs>
          <clipPath id="report-map-frame">
            <rect width={WIDTH} height={HEIGHT} rx="8" />
          </clipPath>
        </defs>
        <g clipPath="url(#report-map-frame)">
          {layer(coast.data?.features, 'land').map((f, i) => <path key={`land-${i}`} d={pathOf(f, projection)} fill="var(--color-paper-raised)" />)}
          {layer(coast.data?.features, 'water').map((f, i) => <path key={`water-${i}`} d={pathOf(f, projection)} fill="var(--color-ink)" fillOpacity="0.07" />)}
          {(streets.data?.features ?? []).map((f, i) => (
            <path key={`street-${i}`} d={pathOf(f, projection)} fill="none" stroke="var(--color-rule-strong)" strokeWidth={f.properties.kind === 'main' ? 2.2 : 1} strokeOpacity="0.8" />
          ))}
          {hoods.map((f, i) => {
            const mine = f.properties.name === snapshot.analysis.subjectGroup;
            return <path key={`hood-${i}`} d={pathOf(f, projection)} fill={mine ? 'var(--color-ink)' : 'none'} fillOpacity={mine ? 0.045 : 0} stroke="var(--color-ink-soft)" strokeWidth="1.3" strokeDasharray="6 4" />;
          })}
          {drawOrder.map((sale) => {
            const [x, y] = at(sale.lon!, sale.lat!);
            const letter = letters.get(sale.id);
            const title = `${sale.address}${sale.excluded ? ' (excluded)' : ''}${flagged.has(sale.id) ? ' (flagged)' : ''}`;
            return (
              <g key={sale.id} data-sale-id={sale.id}>
                <title>{title}</title>
                {sale.excluded ? (
                  <path d={`M${x - 4} ${y - 4}L${x + 4} ${y + 4}M${x + 4} ${y - 4}L${x - 4} ${y + 4}`} stroke="var(--color-rust)" strokeWidth="2" strokeLinecap="round" />
                ) : letter ? (
                  <>
                    <circle cx={x} cy={y} r="11" fill="var(--color-ink)" stroke="var(--color-paper-raised)" strokeWidth="2" />
                    <text x={x} y={y + 4.2} textAnchor="middle" fontSize="12" fontWeight="700" fill="var(--color-paper-raised)" fontFamily="var(--font-mono)">
                      {letter}
                    </text>
                  </>
                ) : (
                  <circle cx={x} cy={y} r="4" fill={residualColour(studentized.get(sale.id))} stroke="var(--color-paper-raised)" strokeWidth="1" />
                )}
                {flagged.has(sale.id) && <circle cx={x} cy={y} r={letter ? 15 : 8} fill="none" stroke="var(--color-flag-ring)" strokeWidth="2" />}
              </g>
            );
          })}
          {layer(coast.data?.features, 'water').map((f) => {
            const p = f.properties.name && f.geometry.type === 'Polygon' ? labelPoint(f) : null;
            if (!p) return null;
            const [x, y] = at(p[0], p[1]);
            return x > 0 && x < WIDTH && y > 0 && y < HEIGHT ? (
              <text key={`water-label-${f.properties.name}`} x={x} y={y} textAnchor="middle" fontSize="12" fontStyle="italic" fill="var(--color-ink-faint)">
                {f.properties.name}
              </text>
            ) : null;
          })}
          {hoods.map((f, i) => {
            const p = labelPoint(f);
            if (!p) return null;
            const [x, y] = at(p[0], p[1]);
            return (
              <text key={`label-${i}`} x={x} y={y} textAnchor="middle" fontSize="13" letterSpacing="1.5" fill="var(--color-ink-soft)" stroke="var(--color-paper-raised)" strokeWidth="4" strokeOpacity="0.85" paintOrder="stroke" style={{ textTransform: 'uppercase', fontWeight: 600 }}>
                {f.properties.name}
              </text>
            );
          })}
          {subject.lon !== null && subject.lat !== null && <SubjectMark at={at(subject.lon, subject.lat)} />}
          <g transform={`translate(${WIDTH - bar.units - 28} ${HEIGHT - 26})`}>
            <rect x="-8" y="-18" width={bar.units + 16} height="30" rx="4" fill="var(--color-paper-raised)" fillOpacity="0.85" />
            <path d={`M0 0H${bar.units}M0 -5V0M${bar.units} -5V0`} stroke="var(--color-ink)" strokeWidth="1.5" fill="none" />
            <text x={bar.units / 2} y="-6" textAnchor="middle" fontSize="11" fill="var(--color-ink-soft)" fontFamily="var(--font-mono)">
              {bar.label}
            </text>
          </g>
        </g>
      </svg>
      <MapLegend unlocated={unlocated} />
    </figure>
  );
}

function SubjectMark({ at: [x, y] }: { at: [number, number] }) {
  return (
    <g data-subject>
      <title>The subject</title>
      <circle cx={x} cy={y} r="15" fill="var(--color-paper-raised)" fillOpacity="0.9" stroke="var(--color-ink)" strokeWidth="2.5" />
      <path d={`M${x - 7} ${y + 6}V${y - 1}L${x} ${y - 7}L${x + 7} ${y - 1}V${y + 6}Z`} fill="var(--color-ink)" />
      <text x={x + 21} y={y + 4.5} fontSize="13" fontWeight="700" fill="var(--color-ink)" stroke="var(--color-paper-raised)" strokeWidth="3.5" paintOrder="stroke">
        Subject
      </text>
    </g>
  );
}

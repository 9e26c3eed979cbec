import type { ReactNode } from 'react';
import type { ReportSnapshot } from '@contracts/report';
import { conditionWords, qualityWords } from '../../../lib/rating-scales';
import { coverPhotoId, gridSales, type SnapshotSale } from '@contracts/report-facts';
import { formatDay, type ReportFormat } from '../lib/report-format';
import { saleTypeWords } from '../lib/feature-words';
import { ReportPhoto } from './report-photo';
import { SaleLedger } from './sale-ledger';

function Facts({ items }: { items: Array<[string, ReactNode]> }) {
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-1.5 text-[0.8125rem]">
      {items.map(([term, value]) => (
        <div key={term} className="min-w-0">
          <dt className="text-ink-faint">{term}</dt>
          <dd className="figures text-ink">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

const rooms = (s: Pick<SnapshotSale, 'bedrooms' | 'bathrooms'>) =>
  s.bedrooms === null && s.bathrooms === null ? '—' : `${s.bedrooms ?? '—'} bd · ${s.bathrooms ?? '—'} ba`;

/** The subject and the sales carried into the adjustment grid: photo, facts, and each sale's
 * adjustments from price to adjusted price. */
export function SalesSection({ reportId, snapshot, format }: { reportId: number; snapshot: ReportSnapshot; format: ReportFormat }) {
  const { subject, grid } = snapshot;
  const sales = gridSales(snapshot);
  const rating = (words: Record<number, string>, v: number | null) => (v === null ? '—' : `${v} · ${words[v] ?? ''}`);
  return (
    <div className="grid items-start gap-4 md:grid-cols-2 xl:grid-cols-4">
      <article aria-label="The subject" className="report-card flex flex-col gap-3 rounded-lg border-2 border-ink bg-paper-raised p-4">
        <ReportPhoto reportId={reportId} photoId={coverPhotoId(snapshot, null)} alt={`The subject, ${snapshot.assignment.subjectAddress}`} />
        <div>
          <p className="text-[0.75rem] font-semibold tracking-wide text-ink-faint uppercase">Subject</p>
          <h3 className="text-[1rem] leading-snug font-semibold text-ink">{snapshot.assignment.subjectAddress}</h3>
          <p className="text-[0.8125rem] text-ink-soft">{subject.neighbourhood ?? 'No neighbourhood recorded'}</p>
        </div>
        <Facts
          items={[
            ['Floor area', format.area(subject.floorArea)],
            ['Lot', format.area(subject.lotSize)],
            ['Rooms', rooms(subject)],
            ['Built', subject.yearBuilt ?? '—'],
            ['Garage', subject.garageSpaces === null ? '—' : `${subject.garageSpaces} ${subject.garageSpaces === 1 ? 'space' : 'spaces'}`],
          ]}
        />
        <dl className="flex flex-col gap-1.5 text-[0.8125rem]">
          <div>
            <dt className="text-ink-faint">Condition</dt>
            <dd className="text-ink">{rating(conditionWords, subject.condition)}</dd>
          </div>
          <div>
            <dt className="text-ink-faint">Quality</dt>
            <dd className="text-ink">{rating(qualityWords, subject.quality)}</dd>
          </div>
        </dl>
      </article>
      {sales.map(({ row, sale, entry, label }) => (
        <article key={sale.id} aria-label={`Sale ${label}: ${sale.address}`} className="report-card flex flex-col gap-3 rounded-lg border border-rule-strong bg-paper-raised p-4">
          <div className="relative">
            <ReportPhoto reportId={reportId} photoId={coverPhotoId(snapshot, sale.id)} alt={`Sale ${label}, ${sale.address}`} />
            <span aria-hidden className="figures absolute top-2 left-2 flex size-7 items-center justify-center rounded-full bg-ink text-[0.8125rem] font-bold text-paper">
              {label}
            </span>
          </div>
          <div>
            <p className="text-[0.75rem] font-semibold tracking-wide text-ink-faint uppercase">Sale {label}</p>
            <h3 className="text-[1rem] leading-snug font-semibold text-ink">{sale.address}</h3>
            <p className="text-[0.8125rem] text-ink-soft">
              {sale.neighbourhood ?? '—'} · {saleTypeWords(sale.saleType)}
            </p>
          </div>
          <Facts
            items={[
              ['Sold', formatDay(sale.saleDate)],
              ['Floor area', format.area(sale.floorArea)],
              ['Rooms', rooms(sale)],
              ['Built', sale.yearBuilt ?? '—'],
            ]}
          />
          <SaleLedger row={row} entry={entry} floorArea={sale.floorArea} subjectArea={grid.subjectArea} rate={grid.rate.value} format={format} />
          {sale.dataSource && <p className="text-[0.75rem] leading-snug text-ink-faint">Source: {sale.dataSource}{sale.verificationNote ? ` — ${sale.verificationNote}` : ''}</p>}
        </article>
      ))}
    </div>
  );
}

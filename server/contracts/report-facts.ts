import type { GroupAnalysis, Trend } from './analysis';
import type { ReportSnapshot } from './report';

// Facts read from a frozen report snapshot, shared by the report page and the PDF so that both say
// the same thing: the subject's neighbourhood fit and trend, and what the review did about each
// flagged or excluded sale.


type Query = ReportSnapshot['queries'][number];
type Message = Query['messages'][number];
export type SnapshotSale = ReportSnapshot['sales'][number];

export function subjectGroup(snapshot: ReportSnapshot): GroupAnalysis | null {
  const { analysis } = snapshot;
  return analysis.groups.find((g) => g.neighbourhood === analysis.subjectGroup && !g.pooled) ?? null;
}

export function subjectTrend(snapshot: ReportSnapshot): Trend | null {
  const { analysis } = snapshot;
  return analysis.subjectGroup === null ? null : (analysis.trends.find((t) => t.neighbourhood === analysis.subjectGroup) ?? null);
}

/** How the review dealt with a sale the fit singled out (or one set aside from the fit). */
export type Outcome = 'kept' | 'excluded' | 'resolved' | 'awaiting' | 'not-queried';

export interface HandledSale {
  saleId: number;
  address: string;
  neighbourhood: string | null;
  flags: string[];
  /** The fit's words for why it stands out; null for an excluded sale the fit no longer sees. */
  why: string | null;
  residualPct: number | null;
  inGrid: boolean;
  outcome: Outcome;
  /** The explanation or the reason, in the appraiser's words. */
  outcomeText: string | null;
  thread: Array<{ who: string; kind: Message['kind']; body: string; at: string }>;
}

function decisiveMessage(queries: readonly Query[]): Message | null {
  const messages = queries.flatMap((q) => q.messages).filter((m) => m.kind === 'kept' || m.kind === 'excluded');
  messages.sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  return messages.at(-1) ?? null;
}

function outcomeOf(excluded: boolean, reason: string | null, queries: readonly Query[]): Pick<HandledSale, 'outcome' | 'outcomeText'> {
  const decisive = decisiveMessage(queries);
  if (excluded) return { outcome: 'excluded', outcomeText: reason ?? (decisive?.kind === 'excluded' ? decisive.body : null) };
  if (decisive?.kind === 'kept') return { outcome: 'kept', outcomeText: decisive.body };
  if (queries.length === 0) return { outcome: 'not-queried', outcomeText: null };
  if (queries.every((q) => q.status === 'resolved')) return { outcome: 'resolved', outcomeText: queries.flatMap((q) => q.messages).at(-1)?.body ?? null };
  return { outcome: 'awaiting', outcomeText: null };
}

/** Every sale a neighbourhood fit flagged, in the analysis's order, then the sales excluded from it. */
export function handledSales(snapshot: ReportSnapshot): HandledSale[] {
  const salesById = new Map(snapshot.sales.map((s) => [s.id, s]));
  const queriesFor = (saleId: number) => snapshot.queries.filter((q) => q.saleId === saleId);
  const threadOf = (saleId: number) =>
    queriesFor(saleId)
      .flatMap((q) => q.messages)
      .sort((a, b) => a.createdAt.localeCompare(b.createdAt))
      .map((m) => ({ who: m.authorName, kind: m.kind, body: m.body, at: m.createdAt }));
  const out: HandledSale[] = [];
  for (const group of snapshot.analysis.groups.filter((g) => !g.pooled)) {
    for (const f of group.flagged) {
      if (out.some((h) => h.saleId === f.saleId)) continue;
      const sale = salesById.get(f.saleId);
      out.push({
        saleId: f.saleId,
        address: f.address,
        neighbourhood: f.neighbourhood,
        flags: [...f.flags],
        why: f.reason,
        residualPct: f.residualPct,
        inGrid: f.inGrid,
        ...outcomeOf(sale?.excluded ?? false, sale?.exclusionReason ?? null, queriesFor(f.saleId)),
        thread: threadOf(f.saleId),
      });
    }
  }
  for (const sale of snapshot.sales.filter((s) => s.excluded && !out.some((h) => h.saleId === s.id))) {
    out.push({
      saleId: sale.id,
      address: sale.address,
      neighbourhood: sale.neighbourhood,
      flags: [],
      why: null,
      residualPct: null,
      inGrid: sale.inGrid,
      ...outcomeOf(true, sale.exclusionReason, queriesFor(sale.id)),
      thread: threadOf(sale.id),
    });
  }
  return out;
}

/** The photo to show for a sale (its cover, else its first), or for the subject (saleId null). */
export function coverPhotoId(snapshot: ReportSnapshot, saleId: number | null): number | null {
  const frozen = snapshot.photos.filter((p) => p.saleId === saleId);
  if (saleId !== null) {
    const cover = snapshot.sales.find((s) => s.id === saleId)?.coverPhotoId ?? null;
    if (cover !== null && frozen.some((p) => p.id === cover)) return cover;
  }
  return frozen[0]?.id ?? null;
}

/** Grid sales in the order of the grid's rows, with their sale records. */
export function gridSales(snapshot: ReportSnapshot) {
  const byId = new Map(snapshot.sales.map((s) => [s.id, s]));
  return snapshot.grid.rows.flatMap((row, index) => {
    const sale = byId.get(row.saleId);
    return sale ? [{ row, sale, entry: snapshot.grid.entries.find((e) => e.saleId === row.saleId) ?? null, label: String.fromCharCode(65 + index) }] : [];
  });
}

/** Every sale flagged by a neighbourhood fit (the pooled fit flags nothing by design). */
export function flaggedSaleIds(snapshot: ReportSnapshot): Set<number> {
  return new Set(snapshot.analysis.groups.filter((g) => !g.pooled).flatMap((g) => g.flagged.map((f) => f.saleId)));
}

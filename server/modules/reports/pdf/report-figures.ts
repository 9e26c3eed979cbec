// Facts the sections derive from the frozen snapshot: the subject's neighbourhood fit and trend,
// and, for each flagged or excluded sale, what the review did about it.
import type { GroupAnalysis, Trend } from '../../../contracts/analysis';
import type { ReportSnapshot } from '../../../contracts/report';

type Query = ReportSnapshot['queries'][number];
type Message = Query['messages'][number];

export function subjectFit(snapshot: ReportSnapshot): { group: GroupAnalysis | null } {
  const { analysis } = snapshot;
  return { group: analysis.groups.find((g) => g.neighbourhood === analysis.subjectGroup && !g.pooled) ?? null };
}

export function subjectTrend(snapshot: ReportSnapshot): Trend | null {
  const { analysis } = snapshot;
  return analysis.subjectGroup === null ? null : (analysis.trends.find((t) => t.neighbourhood === analysis.subjectGroup) ?? null);
}

/** Every sale flagged by a neighbourhood fit (the pooled fit flags nothing by design). */
export function flaggedSaleIds(snapshot: ReportSnapshot): Set<number> {
  return new Set(snapshot.analysis.groups.filter((g) => !g.pooled).flatMap((g) => g.flagged.map((f) => f.saleId)));
}

export type Outcome = 'kept' | 'excluded' | 'awaiting' | 'resolved' | 'not-queried';

export interface HandledSale {
  saleId: number;
  address: string;
  neighbourhood: string | null;
  flags: string[];
  /** The fit's words for why it stands out; null for an excluded sale the current fit no longer sees. */
  why: string | null;
  residualPct: number | null;
  inGrid: boolean;
  outcome: Outcome;
  /** The explanation or reason behind the outcome, in the appraiser's words. */
  outcomeText: string | null;
  thread: Array<{ who: string; kind: Message['kind']; body: string; at: string }>;
}

function decisiveMessage(queries: readonly Query[]): Message | null {
  const messages = queries.flatMap((q) => q.messages).filter((m) => m.kind === 'kept' || m.kind === 'excluded');
  messages.sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  return messages.at(-1) ?? null;
}

function outcomeOf(excluded: boolean, exclusionReason: string | null, queries: readonly Query[]): { outcome: Outcome; outcomeText: string | null } {
  const decisive = decisiveMessage(queries);
  if (excluded) return { outcome: 'excluded', outcomeText: exclusionReason ?? (decisive?.kind === 'excluded' ? decisive.body : null) };
  if (decisive?.kind === 'kept') return { outcome: 'kept', outcomeText: decisive.body };
  if (queries.length === 0) return { outcome: 'not-queried', outcomeText: null };
  if (queries.every((q) => q.status === 'resolved')) {
    const last = queries.flatMap((q) => q.messages).at(-1);
    return { outcome: 'resolved', outcomeText: last?.body ?? null };
  }
  return { outcome: 'awaiting', outcomeText: null };
}

/** Flagged sales first, in the order the analysis ranks them, then sales excluded from it. */
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

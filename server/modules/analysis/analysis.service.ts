import { db } from '../../../db/client';
import type { SessionUser } from '../../contracts/auth';
import { expandAnalysis, type Analysis, type AnalysisWire } from '../../contracts/analysis';
import { analysisWire, transportWire } from '../../analysis/market-analysis';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { findSubject } from '../assignments/assignments.repo';
import { listSales } from '../sales/sales.repo';
import { encodeJson, type EncodedJson } from '../../http/encoded-json';
import { AnalysisCache } from './analysis-cache';

/** What the cache holds per assignment and revision: the analysis for the server's own callers
 * (grid, review queue; its rows are built on first use) and its API response, encoded once. */
export interface CachedAnalysis {
  readonly analysis: Analysis;
  response: EncodedJson;
}

export const analysisCache = new AnalysisCache<CachedAnalysis>();

type AssignmentRow = Awaited<ReturnType<typeof loadAssignmentFor>>;

/** Computes the analysis of an assignment from the database (no cache), with its rows. */
export async function computeAnalysis(assignment: AssignmentRow): Promise<Analysis> {
  return expandAnalysis(await computeAnalysisWire(assignment));
}

/** Computes the analysis of an assignment from the database (no cache), per-sale figures in columns. */
export async function computeAnalysisWire(assignment: AssignmentRow): Promise<AnalysisWire> {
  const [subject, sales] = await Promise.all([findSubject(db, assignment.id), listSales(db, assignment.id)]);
  return analysisWire({
    assignmentId: assignment.id,
    dataRevision: assignment.dataRevision,
    areaUnit: assignment.areaUnit,
    currency: assignment.currency,
    effectiveDate: assignment.effectiveDate,
    timeAdjustment: assignment.timeAdjustment,
    subject: { floorArea: subject?.floorArea ?? null, neighbourhood: subject?.neighbourhood ?? null },
    sales,
  });
}

/** Computations under way, by assignment and data revision: requests that arrive while one runs
 * wait for it instead of starting their own (after an edit, every open page asks at once). */
const inFlight = new Map<string, Promise<CachedAnalysis>>();

/** The JSON text the API sends for an analysis: the one place the wire format is chosen. */
export function analysisWireText(wire: AnalysisWire): string {
  return JSON.stringify(transportWire(wire));
}

/** The response bytes, gzip and ETag, computed once per revision; the rows only when asked for. */
export async function cacheEntry(wire: AnalysisWire): Promise<CachedAnalysis> {
  const response = await encodeJson(analysisWireText(wire));
  let rows: Analysis | undefined;
  return {
    get analysis() {
      return (rows ??= expandAnalysis(wire));
    },
    response,
  };
}

/** The analysis and its encoded response, from the cache while the assignment's data has not changed. */
export async function cachedAnalysis(assignment: AssignmentRow): Promise<CachedAnalysis> {
  const cached = analysisCache.get(assignment.id, assignment.dataRevision);
  if (cached !== undefined) return cached;
  const key = `${assignment.id}:${assignment.dataRevision}`;
  const running = inFlight.get(key);
  if (running) return running;
  const computation = (async () => {
    const entry = await cacheEntry(await computeAnalysisWire(assignment));
    analysisCache.set(assignment.id, assignment.dataRevision, entry);
    return entry;
  })();
  inFlight.set(key, computation);
  try {
    return await computation;
  } finally {
    inFlight.delete(key);
  }
}

/** The encoded API response of an assignment's analysis, for a user who may see the assignment. */
export async function analysisResponse(user: SessionUser, assignmentId: number): Promise<EncodedJson> {
  return (await cachedAnalysis(await loadAssignmentFor(db, user, assignmentId))).response;
}

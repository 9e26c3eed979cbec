import { db } from '../../../db/client';
import type { SessionUser } from '../../contracts/auth';
import type { Analysis } from '../../contracts/analysis';
import { analyseMarket } from '../../analysis/market-analysis';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { findSubject } from '../assignments/assignments.repo';
import { listSales } from '../sales/sales.repo';
import { AnalysisCache } from './analysis-cache';

export const analysisCache = new AnalysisCache<{ analysis: Analysis; json: string }>();

type AssignmentRow = Awaited<ReturnType<typeof loadAssignmentFor>>;

/** Computes the analysis of an assignment from the database (no cache). */
export async function computeAnalysis(assignment: AssignmentRow): Promise<Analysis> {
  const [subject, sales] = await Promise.all([findSubject(db, assignment.id), listSales(db, assignment.id)]);
  return analyseMarket({
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
const inFlight = new Map<string, Promise<{ analysis: Analysis; json: string }>>();

/** The analysis and its JSON text, from the cache while the assignment's data has not changed. */
export async function cachedAnalysis(assignment: AssignmentRow): Promise<{ analysis: Analysis; json: string }> {
  const cached = analysisCache.get(assignment.id, assignment.dataRevision);
  if (cached !== undefined) return cached;
  const key = `${assignment.id}:${assignment.dataRevision}`;
  const running = inFlight.get(key);
  if (running) return running;
  const computation = (async () => {
    const analysis = await computeAnalysis(assignment);
    const entry = { analysis, json: JSON.stringify(analysis) };
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

export async function analysisJson(user: SessionUser, assignmentId: number): Promise<string> {
  return (await cachedAnalysis(await loadAssignmentFor(db, user, assignmentId))).json;
}

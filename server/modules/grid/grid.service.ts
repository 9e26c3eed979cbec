import { distance, point } from '@turf/turf';
import { db } from '../../../db/client';
import type { SessionUser } from '../../contracts/auth';
import type { GridResponse } from '../../contracts/grid';
import { computeGrid, rateNeedsJustification, roundToIncrement } from '../../analysis/adjustment-grid';
import { monthsBefore } from '../../analysis/time-trend';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { findSubject } from '../assignments/assignments.repo';
import { cachedAnalysis } from '../analysis/analysis.service';
import { listSales } from '../sales/sales.repo';
import { loadFirmSettings, loadGridEntries, loadGridSettings } from './grid.repo';
import { gridFigures } from './grid-figures';

type AssignmentRow = Awaited<ReturnType<typeof loadAssignmentFor>>;

/** Builds the grid of an assignment from its data, its analysis and the appraiser's choices. */
export async function buildGrid(assignment: AssignmentRow): Promise<GridResponse> {
  const [subject, sales, settings, limits, entries, { analysis }] = await Promise.all([
    findSubject(db, assignment.id),
    listSales(db, assignment.id),
    loadGridSettings(db, assignment.id),
    loadFirmSettings(db, assignment.firmOrganisationId),
    loadGridEntries(db, assignment.id),
    cachedAnalysis(assignment),
  ]);
  const group = analysis.groups.find((g) => g.neighbourhood === analysis.subjectGroup && !g.pooled) ?? null;
  const gatePasses = group?.gate?.passes ?? false;
  const fitSlope = group?.fit?.slope ?? null;
  const typedRate = settings.typedRate;
  const rateValue = typedRate ?? (fitSlope === null ? null : roundToIncrement(fitSlope, settings.rateIncrement));
  const needsJustification = rateNeedsJustification(gatePasses, typedRate);
  const trend = analysis.trends.find((t) => t.neighbourhood === analysis.subjectGroup) ?? null;
  const monthlyRate = assignment.timeAdjustment ? (trend?.monthlyRate ?? null) : null;
  const flaggedReason = new Map(analysis.groups.flatMap((g) => g.flagged.map((f) => [f.saleId, f.reason] as const)));
  const entryBySale = new Map(entries.map((e) => [e.saleId, e]));
  const gridSales = sales.filter((s) => s.inGrid && !s.excluded);
  const subjectArea = subject?.floorArea ?? null;

  const grid =
    subjectArea === null || rateValue === null
      ? null
      : computeGrid({
          subjectArea,
          monthlyRate,
          rate: rateValue,
          valueIncrement: settings.valueIncrement,
          limits,
          sales: gridSales.map((s) => ({
            saleId: s.id,
            address: s.address,
            salePrice: s.salePrice,
            floorArea: s.floorArea,
            sellerConcessions: s.sellerConcessions,
            monthsBefore: monthsBefore(s.saleDate, assignment.effectiveDate),
            distanceKm:
              subject?.lon != null && subject.lat != null && s.lon != null && s.lat != null
                ? distance(point([subject.lon, subject.lat]), point([s.lon, s.lat]), { units: 'kilometers' })
                : null,
            flaggedByFit: flaggedReason.get(s.id) ?? null,
            lineItems: entryBySale.get(s.id)?.lineItems ?? [],
            weightPct: entryBySale.get(s.id)?.weightPct ?? null,
          })),
        });

  const missing: string[] = [];
  if (subjectArea === null) missing.push('The subject’s floor area.');
  if (rateValue === null) missing.push('A floor-area rate: the subject’s neighbourhood has no usable fit, so type one.');
  if (needsJustification && !settings.rateJustification) missing.push('A written justification of the floor-area rate.');
  if (gridSales.length === 0) missing.push('At least one sale marked for the grid.');
  if (grid && grid.indicatedValue === null && gridSales.length > 0) missing.push('Weights that total 100%.');
  if (!settings.reconciliationComment) missing.push('A reconciliation comment.');

  return {
    settings: {
      typedRate,
      rateJustification: settings.rateJustification,
      rateIncrement: settings.rateIncrement,
      valueIncrement: settings.valueIncrement,
      reconciliationComment: settings.reconciliationComment,
      version: settings.version,
    },
    limits: { netLimitPct: limits.netLimitPct, grossLimitPct: limits.grossLimitPct, maxSaleAgeMonths: limits.maxSaleAgeMonths, maxDistanceKm: limits.maxDistanceKm, checkBracketing: limits.checkBracketing },
    rate: {
      fitSlope,
      fitNeighbourhood: group?.neighbourhood ?? null,
      gatePasses,
      gateMessage: group?.gate?.message ?? 'No neighbourhood fit for the subject yet.',
      value: rateValue,
      source: typedRate !== null ? 'typed' : rateValue !== null ? 'fit' : 'none',
      needsJustification,
    },
    monthlyRate,
    subjectArea,
    entries: entries.map((e) => ({ saleId: e.saleId, lineItems: e.lineItems, weightPct: e.weightPct, version: e.version })),
    ...gridFigures(grid, group),
    missing,
  };
}

export async function getGrid(user: SessionUser, assignmentId: number) {
  return buildGrid(await loadAssignmentFor(db, user, assignmentId));
}

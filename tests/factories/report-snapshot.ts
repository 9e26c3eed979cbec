import { analyseMarket, type AnalysisSale } from '../../server/analysis/market-analysis';
import { computeGrid, roundToIncrement } from '../../server/analysis/adjustment-grid';
import { monthsBefore } from '../../server/analysis/time-trend';
import { reportSnapshotSchema, type ReportSnapshot } from '../../server/contracts/report';
import type { GridResponse } from '../../server/contracts/grid';
import { gridFigures } from '../../server/modules/grid/grid-figures';
import type { SaleType } from '../../server/contracts/sales';
import { CAUTIONS, CERTIFICATION_STATEMENTS, LIMITING_CONDITIONS } from '../../server/contracts/report-text';
import { canonicalJson, sha256Hex } from '../../server/modules/reports/canonical-json';

/** A signed report built in memory from invented Port Ellery sales (the town does not exist). The
 * analysis and grid come from the real pure modules, so every figure agrees with every other. */

const EFFECTIVE_DATE = '2026-11-15';

interface SaleSeed {
  address: string;
  neighbourhood: string;
  saleDate: string;
  floorArea: number;
  salePrice: number;
  saleType?: SaleType;
  sellerConcessions?: number;
  inGrid?: boolean;
  exclusionReason?: string;
}

const FORECLOSURE = 'Bank-owned sale after foreclosure, sold as-is with water damage on the ground floor; not comparable to the subject.';
const FAMILY = 'Transfer from a parent to a daughter at about 60% of market (confirmed with the listing agent); not an arm’s-length sale.';

/** Quarry Hill follows roughly $118,000 + $176/ft², rising about 0.35% a month; Tannery Row is cheaper. */
export const PORT_ELLERY_SALES: readonly SaleSeed[] = [
  { address: '22 Lantern Lane', neighbourhood: 'Quarry Hill', saleDate: '2026-09-18', floorArea: 1760, salePrice: 428_000, inGrid: true },
  { address: '7 Flint Street', neighbourhood: 'Quarry Hill', saleDate: '2026-08-02', floorArea: 1905, salePrice: 443_500, sellerConcessions: 6_000, inGrid: true },
  { address: '31 Hillside Avenue', neighbourhood: 'Quarry Hill', saleDate: '2026-10-06', floorArea: 1690, salePrice: 415_000, inGrid: true },
  { address: '18 Cobble Lane', neighbourhood: 'Quarry Hill', saleDate: '2026-06-21', floorArea: 1980, salePrice: 464_000, inGrid: true },
  { address: '40 Mason Street', neighbourhood: 'Quarry Hill', saleDate: '2026-04-11', floorArea: 1540, salePrice: 373_500 },
  { address: '9 Quarry Road', neighbourhood: 'Quarry Hill', saleDate: '2026-02-27', floorArea: 2210, salePrice: 499_000 },
  { address: '15 Ledge Street', neighbourhood: 'Quarry Hill', saleDate: '2025-12-14', floorArea: 1420, salePrice: 356_500 },
  { address: '26 Flint Street', neighbourhood: 'Quarry Hill', saleDate: '2026-05-30', floorArea: 1830, salePrice: 423_000 },
  { address: '3 Gull Street', neighbourhood: 'Quarry Hill', saleDate: '2026-01-19', floorArea: 1610, salePrice: 438_000 },
  { address: '44 Hillside Avenue', neighbourhood: 'Quarry Hill', saleDate: '2026-07-15', floorArea: 1275, salePrice: 341_500 },
  { address: '12 Mason Street', neighbourhood: 'Quarry Hill', saleDate: '2026-01-08', floorArea: 2060, salePrice: 460_000 },
  { address: '51 Lantern Lane', neighbourhood: 'Quarry Hill', saleDate: '2025-11-02', floorArea: 1745, salePrice: 405_000 },
  { address: '5 Quarry Road', neighbourhood: 'Quarry Hill', saleDate: '2026-03-22', floorArea: 3120, salePrice: 629_500 },
  { address: '28 Gull Street', neighbourhood: 'Quarry Hill', saleDate: '2026-06-05', floorArea: 1860, salePrice: 328_000, saleType: 'distressed', exclusionReason: FORECLOSURE },
  { address: '33 Ledge Street', neighbourhood: 'Quarry Hill', saleDate: '2026-07-29', floorArea: 1700, salePrice: 243_000, saleType: 'family', exclusionReason: FAMILY },
  { address: '20 Cobble Lane', neighbourhood: 'Quarry Hill', saleDate: '2026-10-20', floorArea: 1585, salePrice: 395_000 },
  { address: '4 Tanner Street', neighbourhood: 'Tannery Row', saleDate: '2026-08-14', floorArea: 1480, salePrice: 307_000 },
  { address: '17 Ropewalk', neighbourhood: 'Tannery Row', saleDate: '2026-05-03', floorArea: 1320, salePrice: 275_500 },
  { address: '9 Bark Lane', neighbourhood: 'Tannery Row', saleDate: '2026-02-11', floorArea: 1650, salePrice: 326_500 },
  { address: '21 Mill Street', neighbourhood: 'Tannery Row', saleDate: '2025-12-01', floorArea: 1210, salePrice: 257_500 },
  { address: '30 Tanner Street', neighbourhood: 'Tannery Row', saleDate: '2026-09-25', floorArea: 1560, salePrice: 315_000 },
  { address: '6 Ropewalk', neighbourhood: 'Tannery Row', saleDate: '2026-10-30', floorArea: 1395, salePrice: 297_500 },
];

type LineItem = GridResponse['entries'][number]['lineItems'][number];

const LINE_ITEMS: Record<string, LineItem[]> = {
  '22 Lantern Lane': [{ feature: 'garage', amount: -6_000, note: 'two-car garage; the subject has one' }],
  '7 Flint Street': [
    { feature: 'bathrooms', amount: 4_500, note: 'one bathroom fewer than the subject' },
    { feature: 'condition', amount: -8_000, note: 'kitchen renovated in 2025' },
  ],
  '18 Cobble Lane': [{ feature: 'view', amount: -5_000, note: 'harbour glimpse from the upper floor' }],
};

type Sale = ReportSnapshot['sales'][number];

function toSale(seed: SaleSeed, index: number): Sale {
  return {
    id: 101 + index,
    assignmentId: 7,
    address: seed.address,
    lon: Number((-61.415 + (index % 7) * 0.0021).toFixed(6)),
    lat: Number((44.706 + Math.floor(index / 7) * 0.0017).toFixed(6)),
    neighbourhood: seed.neighbourhood,
    salePrice: seed.salePrice,
    saleDate: seed.saleDate,
    floorArea: seed.floorArea,
    lotSize: Math.round(seed.floorArea * 2.6),
    bedrooms: seed.floorArea > 1800 ? 4 : 3,
    bathrooms: seed.floorArea > 1900 ? 2.5 : 2,
    yearBuilt: 1948 + ((index * 7) % 60),
    condition: 3,
    quality: 3,
    garageSpaces: 1,
    saleType: seed.saleType ?? 'arms_length',
    sellerConcessions: seed.sellerConcessions ?? 0,
    dataSource: 'Port Ellery registry of deeds',
    verificationNote: index % 3 === 0 ? 'confirmed with the buyer’s agent' : null,
    inGrid: seed.inGrid ?? false,
    excluded: seed.exclusionReason !== undefined,
    exclusionReason: seed.exclusionReason ?? null,
    coverPhotoId: null,
    photoCount: 0,
    version: 2,
  };
}

function gridFor(sales: readonly Sale[], analysis: ReportSnapshot['analysis'], subjectArea: number | null, comment: string | null): GridResponse {
  const group = analysis.groups.find((g) => g.neighbourhood === analysis.subjectGroup && !g.pooled) ?? null;
  const trend = analysis.trends.find((t) => t.neighbourhood === analysis.subjectGroup) ?? null;
  const fitSlope = group?.fit?.slope ?? null;
  const rate = fitSlope === null ? null : roundToIncrement(fitSlope, 1);
  const monthlyRate = analysis.timeAdjustment ? (trend?.monthlyRate ?? null) : null;
  const limits = { netLimitPct: 15, grossLimitPct: 25, maxSaleAgeMonths: 12, maxDistanceKm: 1.5, checkBracketing: true };
  const flaggedReason = new Map((group?.flagged ?? []).map((f) => [f.saleId, f.reason]));
  const gridSales = sales.filter((s) => s.inGrid && !s.excluded);
  const grid =
    subjectArea === null || rate === null
      ? null
      : computeGrid({
          subjectArea,
          monthlyRate,
          rate,
          valueIncrement: 1_000,
          limits,
          sales: gridSales.map((s) => ({
            saleId: s.id,
            address: s.address,
            salePrice: s.salePrice,
            floorArea: s.floorArea,
            sellerConcessions: s.sellerConcessions,
            monthsBefore: monthsBefore(s.saleDate, EFFECTIVE_DATE),
            distanceKm: 0.4,
            flaggedByFit: flaggedReason.get(s.id) ?? null,
            lineItems: LINE_ITEMS[s.address] ?? [],
            weightPct: null,
          })),
        });
  const missing = [...(rate === null ? ['A floor-area rate: the subject’s neighbourhood has no usable fit, so type one.'] : []), ...(comment ? [] : ['A reconciliation comment.'])];
  return {
    settings: { typedRate: null, rateJustification: null, rateIncrement: 1, valueIncrement: 1_000, reconciliationComment: comment, version: 3 },
    limits,
    rate: {
      fitSlope,
      fitNeighbourhood: group?.neighbourhood ?? null,
      gatePasses: group?.gate?.passes ?? false,
      gateMessage: group?.gate?.message ?? 'No neighbourhood fit for the subject yet.',
      value: rate,
      source: rate === null ? 'none' : 'fit',
      needsJustification: !(group?.gate?.passes ?? false),
    },
    monthlyRate,
    subjectArea,
    entries: gridSales.map((s) => ({ saleId: s.id, lineItems: LINE_ITEMS[s.address] ?? [], weightPct: null, version: 1 })),
    ...gridFigures(grid, group),
    missing,
  };
}

const message = (id: number, authorName: string, authorRole: string, kind: 'question' | 'kept' | 'excluded' | 'resolved', body: string, createdAt: string) => ({ id, authorName, authorRole, kind, body, createdAt });

function queriesFor(sales: readonly Sale[]): ReportSnapshot['queries'] {
  const byAddress = (address: string) => sales.find((s) => s.address === address);
  const large = byAddress('5 Quarry Road');
  const distressed = byAddress('28 Gull Street');
  const out: ReportSnapshot['queries'] = [];
  if (large) {
    out.push({
      id: 41, assignmentId: 7, saleId: large.id, saleAddress: large.address, status: 'resolved', raisedByName: 'Tomas Lindqvist', version: 4, createdAt: '2026-11-10T14:02:00.000Z',
      messages: [
        message(301, 'Tomas Lindqvist', 'reviewer', 'question', 'The largest house in the set pulls hard on the slope. Is its floor area verified?', '2026-11-10T14:02:00.000Z'),
        message(302, 'Maren Okafor', 'appraiser', 'kept', 'Floor area confirmed at 3,120 ft² from the builder’s plans and the assessor’s card; an arm’s-length sale after 41 days on the market. It stays in the fit as a genuine sale.', '2026-11-11T09:15:00.000Z'),
        message(303, 'Tomas Lindqvist', 'reviewer', 'resolved', 'Accepted.', '2026-11-11T10:40:00.000Z'),
      ],
    });
  }
  if (distressed) {
    out.push({
      id: 42, assignmentId: 7, saleId: distressed.id, saleAddress: distressed.address, status: 'resolved', raisedByName: 'Tomas Lindqvist', version: 3, createdAt: '2026-11-10T14:05:00.000Z',
      messages: [
        message(304, 'Tomas Lindqvist', 'reviewer', 'question', 'This sale sits about a quarter below the line. What was its condition at sale?', '2026-11-10T14:05:00.000Z'),
        message(305, 'Maren Okafor', 'appraiser', 'excluded', FORECLOSURE, '2026-11-11T09:20:00.000Z'),
      ],
    });
  }
  return out;
}

export interface ReportSnapshotOptions {
  sales?: readonly SaleSeed[];
  subjectNeighbourhood?: string;
  subjectArea?: number | null;
  reconciliationComment?: string | null;
}

export function buildReportSnapshot(options: ReportSnapshotOptions = {}): ReportSnapshot {
  const sales = (options.sales ?? PORT_ELLERY_SALES).map(toSale);
  const subjectNeighbourhood = options.subjectNeighbourhood ?? 'Quarry Hill';
  const subjectArea = options.subjectArea === undefined ? 1_820 : options.subjectArea;
  const analysisSales: AnalysisSale[] = sales.map((s) => ({ ...s, neighbourhood: s.neighbourhood }));
  const analysis = analyseMarket({
    assignmentId: 7, dataRevision: 9, areaUnit: 'sqft', currency: 'USD', effectiveDate: EFFECTIVE_DATE, timeAdjustment: true,
    subject: { floorArea: subjectArea, neighbourhood: subjectNeighbourhood },
    sales: analysisSales,
  });
  const comment = options.reconciliationComment === undefined
    ? 'Most weight goes to 31 Hillside Avenue and 22 Lantern Lane, the two most recent sales closest to the subject in size and needing the least adjustment. 18 Cobble Lane brackets the subject from above. The opinion sits inside the regression’s prediction interval and the range of adjusted prices.'
    : options.reconciliationComment;
  const grid = gridFor(sales, analysis, subjectArea, comment);
  const snapshot: ReportSnapshot = {
    schemaVersion: 1,
    firmName: 'Lantern Valuation Group',
    clientName: 'Harbourside Mutual',
    assignment: {
      id: 7, subjectAddress: '14 Lantern Lane, Port Ellery', intendedUse: 'Mortgage lending decision for a purchase loan', loanReference: 'HM-2026-04417',
      clientOrganisationId: 2, clientOrganisationName: 'Harbourside Mutual', appraiserUserId: 3, appraiserName: 'Maren Okafor',
      effectiveDate: EFFECTIVE_DATE, dueDate: '2026-11-20', areaUnit: 'sqft', currency: 'USD', status: 'signed', timeAdjustment: true,
      version: 12, dataRevision: 9, saleCount: sales.length, updatedAt: '2026-11-16T15:30:00.000Z',
    },
    subject: {
      assignmentId: 7, version: 5, lon: -61.41152, lat: 44.70658, neighbourhood: subjectNeighbourhood, floorArea: subjectArea, lotSize: 4_900,
      bedrooms: 3, bathrooms: 2.5, yearBuilt: 1962, condition: 3, quality: 3, garageSpaces: 1,
      notes: 'Two-storey frame house on a level lot; roof replaced in 2021; original windows.',
    },
    sales,
    photos: [],
    analysis,
    grid,
    queries: queriesFor(sales),
    cautions: [...CAUTIONS],
    certification: [...CERTIFICATION_STATEMENTS],
    limitingConditions: [...LIMITING_CONDITIONS],
    extraordinaryAssumptions: 'The attic was not accessible at the inspection on November 12, 2026; it is assumed to be in the same condition as the rest of the house.',
    hypotheticalConditions: '',
    signer: { name: 'Maren Okafor', licenceNumber: 'CR-4471-NS', jurisdiction: 'Port Ellery Real Estate Appraisers Board' },
    signedAt: '2026-11-16T15:32:00.000Z',
    versionNumber: 2,
    reconciliationComment: comment,
    opinionOfValue: grid.opinionOfValue,
  };
  return reportSnapshotSchema.parse(JSON.parse(canonicalJson(snapshot)));
}

/** A report whose subject's neighbourhood has too few sales to fit: no estimate, no grid, no opinion. */
export function thinReportSnapshot(): ReportSnapshot {
  const sales = [
    ...PORT_ELLERY_SALES.filter((s) => s.neighbourhood === 'Tannery Row'),
    { address: '12 Pippin Lane', neighbourhood: 'Orchard Rise', saleDate: '2026-07-02', floorArea: 1710, salePrice: 455_000, inGrid: true },
    { address: '8 Russet Street', neighbourhood: 'Orchard Rise', saleDate: '2026-09-12', floorArea: 1880, salePrice: 489_000 },
  ];
  return buildReportSnapshot({ sales, subjectNeighbourhood: 'Orchard Rise', reconciliationComment: null });
}

export function reportFingerprint(snapshot: ReportSnapshot): string {
  return sha256Hex(canonicalJson(snapshot));
}

// The adjustment grid and the reconciliation: the floor-area rate and where it comes from, each grid
// sale's adjustments down to its adjusted price, net and gross shares and weight, then the indicated
// value, its rounding, the adjusted range, the appraiser's comment and what a reviewer would ask.
import { lineItemFeatureLabels } from '../../../contracts/grid';
import { FONT, printable } from './fonts';
import { money, perArea, percent, signedMoney, signedPercent } from './format';
import { ensureSpace, facts, list, paragraph, place, sectionTitle, subheading, textHeight, type ReportContext } from './layout';
import { flaggedSaleIds } from '../../../contracts/report-facts';
import { table, type Column, type TableRow } from './table';
import { ACCENT, CONTENT_WIDTH, INK, PAGE, STATE } from './theme';

function rateFacts(ctx: ReportContext): void {
  const { doc, snapshot, units } = ctx;
  const { rate } = snapshot.grid;
  const source =
    rate.source === 'fit'
      ? `Slope of the ${rate.fitNeighbourhood ?? 'neighbourhood'} fit (${perArea(rate.fitSlope, units)}), rounded`
      : rate.source === 'typed'
        ? 'Typed by the appraiser'
        : 'No rate: no usable fit and none typed';
  facts(
    doc,
    [
      { label: 'Floor-area rate', value: perArea(rate.value, units), figure: true },
      { label: 'Rate source', value: source },
      { label: 'Market conditions', value: snapshot.grid.monthlyRate === null ? 'No time adjustment' : `${signedPercent(snapshot.grid.monthlyRate)} a month`, figure: snapshot.grid.monthlyRate !== null },
    ],
    3,
  );
  paragraph(doc, rate.gateMessage, { size: 8.2, colour: rate.gatePasses ? INK.soft : STATE.rust });
  if (rate.source === 'typed' || (rate.needsJustification && rate.source !== 'none')) {
    const justification = snapshot.grid.settings.rateJustification?.trim() || 'No justification was written.';
    subheading(doc, 'Why this rate', 30);
    paragraph(doc, justification, { size: 9 });
  }
}

function gridTable(ctx: ReportContext): void {
  const { doc, snapshot, units } = ctx;
  const { grid } = snapshot;
  const flagged = flaggedSaleIds(snapshot);
  const entries = new Map(grid.entries.map((e) => [e.saleId, e]));
  const c = units.currency;
  const columns: Column[] = [
    { header: 'Grid sale', width: 86 },
    { header: 'Sale price', width: 52, align: 'right', figure: true },
    { header: 'Concession', width: 62, align: 'right', figure: true },
    { header: 'Time', width: 44, align: 'right', figure: true },
    { header: 'Floor area', width: 50, align: 'right', figure: true },
    { header: 'Line items', width: 46, align: 'right', figure: true },
    { header: 'Adjusted price', width: 54, align: 'right', figure: true },
    { header: 'Net', width: 34, align: 'right', figure: true },
    { header: 'Gross', width: 36, align: 'right', figure: true },
    { header: 'Weight', width: 40, align: 'right', figure: true },
  ];
  const rows: TableRow[] = grid.rows.map((r) => {
    const items = entries.get(r.saleId)?.lineItems ?? [];
    const itemText = items.map((li) => `${lineItemFeatureLabels[li.feature]} ${signedMoney(li.amount, c)}${li.note ? ` (${li.note})` : ''}`).join('; ');
    const limits: string[] = [];
    if (r.netOverLimit) limits.push(`net above ${grid.limits.netLimitPct}%`);
    if (r.grossOverLimit) limits.push(`gross above ${grid.limits.grossLimitPct}%`);
    const note = [itemText, limits.length ? `Guideline: ${limits.join(', ')}` : ''].filter(Boolean).join('  ·  ');
    return {
      cells: [
        r.address,
        money(r.salePrice, c),
        signedMoney(r.concessionAdjustment, c),
        signedMoney(r.timeAdjustment, c),
        signedMoney(r.areaAdjustment, c),
        signedMoney(r.lineItemTotal, c),
        money(r.adjustedPrice, c),
        percent(r.netAdjustmentPct),
        percent(r.grossAdjustmentPct),
        percent(r.weightPct / 100),
      ],
      cellColours: [undefined, undefined, undefined, undefined, undefined, undefined, undefined, r.netOverLimit ? STATE.rust : undefined, r.grossOverLimit ? STATE.rust : undefined, undefined],
      note: note || undefined,
      flagged: flagged.has(r.saleId),
    };
  });
  table(doc, columns, rows, PAGE.left, 7.4);
  const weighting = grid.rows.some((r) => !r.weightIsDefault) ? 'Weights set by the appraiser.' : 'Weights by default in proportion to 1 / gross adjustment.';
  paragraph(doc, `${weighting} Net = |sum of adjustments| / sale price; gross = sum of |adjustments| / sale price; guideline flags above ${grid.limits.netLimitPct}% net and ${grid.limits.grossLimitPct}% gross (common practice, configurable).`, { size: 7.4, colour: INK.faint });
}

function reconciliation(ctx: ReportContext): void {
  const { doc, snapshot, units } = ctx;
  const { grid } = snapshot;
  const c = units.currency;
  subheading(doc, 'Reconciliation', 90);
  facts(
    doc,
    [
      { label: 'Indicated value', value: money(grid.indicatedValue, c), figure: true },
      { label: 'Rounded to the nearest', value: money(grid.settings.valueIncrement, c), figure: true },
      { label: 'Opinion of value', value: money(snapshot.opinionOfValue, c), figure: true },
      { label: 'Adjusted range', value: grid.adjustedRange ? `${money(grid.adjustedRange[0], c)} to ${money(grid.adjustedRange[1], c)}` : '—', figure: true },
    ],
    4,
  );
  const comment = snapshot.reconciliationComment?.trim() || 'No reconciliation comment was written.';
  const h = textHeight(doc, comment, { size: 9.2, width: CONTENT_WIDTH - 26, lineGap: 2 });
  const fitsOnAPage = h < 480;
  ensureSpace(doc, (fitsOnAPage ? h : 60) + 30);
  const y = doc.y;
  if (fitsOnAPage) doc.save().rect(PAGE.left, y, 2.5, h + 18).fill(ACCENT.ochre).restore();
  place(doc, 'Appraiser’s reconciliation', PAGE.left + 14, y + 1, { font: FONT.textMedium, size: 7.8, colour: ACCENT.ochreDeep });
  doc.y = y + 13;
  doc.font(FONT.text).fontSize(9.2).fillColor(INK.ink).text(printable(comment), PAGE.left + 14, doc.y, { width: CONTENT_WIDTH - 26, lineGap: 2 });
  doc.x = PAGE.left;
  doc.y += 10;
}

function reviewPoints(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  const points = [...new Set([...snapshot.grid.checks.map((ch) => ch.message), ...snapshot.analysis.warnings])];
  if (points.length > 0) {
    subheading(doc, 'Points a reviewer would ask about', 40);
    list(doc, points, false, { size: 8.4, colour: INK.soft });
  }
  if (snapshot.grid.missing.length > 0) {
    subheading(doc, 'Still open when the report was signed', 40);
    list(doc, snapshot.grid.missing, false, { size: 8.4, colour: STATE.rust });
  }
}

export function gridSection(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  sectionTitle(doc, 'Adjustments and reconciliation', 'Each grid sale, from its price through concessions, market conditions, floor area and the appraiser’s line items to an adjusted price.', 160);
  rateFacts(ctx);
  if (snapshot.grid.rows.length === 0) {
    const why = snapshot.grid.missing.length > 0 ? 'No grid could be computed; what was still open is listed below.' : 'No sale was adjusted in a grid for this report.';
    paragraph(doc, why, { colour: INK.soft });
  } else {
    gridTable(ctx);
  }
  reconciliation(ctx);
  reviewPoints(ctx);
}

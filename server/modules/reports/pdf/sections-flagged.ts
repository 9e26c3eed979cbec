// Flagged sales and how each was handled: why the fit singled it out, what the review asked, and
// whether the appraiser kept it (with the explanation) or excluded it (with the reason).
import { FONT } from './fonts';
import { shortDate } from './format';
import { ensureSpace, newPage, paragraph, place, rule, sectionTitle, textHeight, textWidth, type ReportContext } from './layout';
import { handledSales, type HandledSale, type Outcome } from '../../../contracts/report-facts';
import { CONTENT_WIDTH, FLAG_RING, INK, PAGE, STATE } from './theme';

const OUTCOME: Record<Outcome, { label: string; colour: string; wash: string; fallback: string }> = {
  kept: { label: 'Kept', colour: STATE.teal, wash: STATE.tealWash, fallback: 'Kept in the analysis; no explanation was written.' },
  excluded: { label: 'Excluded', colour: STATE.rust, wash: STATE.rustWash, fallback: 'Excluded; no reason was recorded.' },
  resolved: { label: 'Resolved', colour: INK.soft, wash: INK.tintStrong, fallback: 'The query was resolved without a written answer.' },
  awaiting: { label: 'Open query', colour: INK.soft, wash: INK.tintStrong, fallback: 'Queried; no answer was recorded before signing.' },
  'not-queried': { label: 'Not queried', colour: INK.faint, wash: INK.tint, fallback: 'No query was raised; the sale stays in the analysis as recorded.' },
};

const KIND_WORDS: Record<HandledSale['thread'][number]['kind'], string> = {
  question: 'Asked',
  comment: 'Commented',
  kept: 'Kept',
  excluded: 'Excluded',
  resolved: 'Resolved',
  reopened: 'Reopened',
};

const INDENT = 18;
const BODY_WIDTH = CONTENT_WIDTH - INDENT;

/** The review thread, less the message the outcome box already quotes. */
function threadLines(sale: HandledSale): string[] {
  const quoted = sale.outcomeText?.trim();
  return sale.thread.filter((m) => !(quoted && m.body.trim() === quoted && (m.kind === 'kept' || m.kind === 'excluded'))).map((m) => `${KIND_WORDS[m.kind]} by ${m.who}, ${shortDate(m.at)}: ${m.body}`);
}

function blockHeight(doc: PDFKit.PDFDocument, sale: HandledSale, outcomeText: string): number {
  let h = 16;
  if (sale.why) h += textHeight(doc, sale.why, { size: 8.4, width: BODY_WIDTH }) + 4;
  h += textHeight(doc, outcomeText, { size: 8.6, width: BODY_WIDTH - 78 }) + 8;
  for (const line of threadLines(sale)) h += textHeight(doc, line, { size: 7.6, width: BODY_WIDTH - 8 }) + 2;
  return h + 12;
}

function saleBlock(ctx: ReportContext, sale: HandledSale): void {
  const { doc } = ctx;
  const outcome = OUTCOME[sale.outcome];
  const outcomeText = sale.outcomeText?.trim() || outcome.fallback;
  ensureSpace(doc, Math.min(blockHeight(doc, sale, outcomeText), 260));
  let y = doc.y;
  if (sale.flags.length > 0) doc.save().circle(PAGE.left + 6, y + 5.5, 4.2).lineWidth(1.6).strokeColor(FLAG_RING).stroke().restore();
  else doc.save().moveTo(PAGE.left + 1.5, y + 5.5).lineTo(PAGE.left + 10.5, y + 5.5).lineWidth(1.6).strokeColor(STATE.rust).stroke().restore();
  const title = sale.address;
  place(doc, title, PAGE.left + INDENT, y, { font: FONT.textBold, size: 10, width: BODY_WIDTH });
  let tx = PAGE.left + INDENT + textWidth(doc, title, { font: FONT.textBold, size: 10 }) + 10;
  const tags = [sale.neighbourhood ?? '', ...sale.flags.map((f) => f.replace('-', ' ')), sale.inGrid ? 'in the grid' : ''].filter(Boolean);
  for (const tag of tags) {
    const w = textWidth(doc, tag, { font: FONT.textMedium, size: 6.8 });
    if (tx + w + 8 > PAGE.width - PAGE.right) break;
    const isFlag = sale.flags.some((f) => f.replace('-', ' ') === tag);
    doc.save().roundedRect(tx, y + 1, w + 8, 10, 5).lineWidth(0.6).strokeColor(isFlag ? FLAG_RING : INK.ruleStrong).stroke().restore();
    place(doc, tag, tx + 4, y + 2.6, { font: FONT.textMedium, size: 6.8, colour: isFlag ? FLAG_RING : INK.soft, width: w + 2 });
    tx += w + 12;
  }
  y += 16;
  if (sale.why) y += place(doc, sale.why, PAGE.left + INDENT, y, { size: 8.4, colour: INK.soft, width: BODY_WIDTH }) + 4;

  const labelWidth = textWidth(doc, outcome.label.toUpperCase(), { font: FONT.textBold, size: 6.8, characterSpacing: 0.6 });
  const textH = textHeight(doc, outcomeText, { size: 8.6, width: BODY_WIDTH - 78 });
  doc.save().rect(PAGE.left + INDENT, y, BODY_WIDTH, textH + 8).fill(outcome.wash).restore();
  place(doc, outcome.label.toUpperCase(), PAGE.left + INDENT + 6, y + 5, { font: FONT.textBold, size: 6.8, colour: outcome.colour, characterSpacing: 0.6, width: labelWidth + 4 });
  place(doc, outcomeText, PAGE.left + INDENT + 72, y + 4, { size: 8.6, colour: INK.ink, width: BODY_WIDTH - 78 });
  y += textH + 12;
  for (const line of threadLines(sale)) {
    const h = textHeight(doc, line, { size: 7.6, width: BODY_WIDTH - 8 });
    if (y + h > PAGE.height - PAGE.bottom) {
      newPage(doc);
      y = doc.y;
    }
    y += place(doc, line, PAGE.left + INDENT + 8, y, { size: 7.6, colour: INK.soft, width: BODY_WIDTH - 8 }) + 2;
  }
  doc.y = y + 6;
  rule(doc, doc.y, INK.rule);
  doc.y += 8;
}

export function flaggedSection(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  const sales = handledSales(snapshot);
  const flaggedCount = sales.filter((s) => s.flags.length > 0).length;
  const excludedCount = sales.filter((s) => s.outcome === 'excluded').length;
  sectionTitle(
    doc,
    'Flagged sales and how each was handled',
    `${flaggedCount} sale${flaggedCount === 1 ? '' : 's'} flagged by a neighbourhood fit; ${excludedCount} excluded. A flag is a question about a sale, answered from its facts.`,
    120,
  );
  if (sales.length === 0) {
    paragraph(doc, 'The fits flagged no sale, and no sale was excluded.', { colour: INK.soft });
    return;
  }
  for (const sale of sales) saleBlock(ctx, sale);
}

// What every page carries, written once all pages exist: a running head from page 2 on, and a
// footer with the full SHA-256 fingerprint and "Page n of N".
import { FONT } from './fonts';
import { longDate } from './format';
import { place, rule, textWidth, type ReportContext } from './layout';
import { brandMark } from './sections-opening';
import { INK, PAGE } from './theme';

function runningHead(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  const y = 36;
  brandMark(doc, PAGE.left, y - 1, 11);
  const left = `${snapshot.assignment.subjectAddress}  ·  Appraisal report, version ${snapshot.versionNumber}`;
  place(doc, left, PAGE.left + 17, y + 1, { font: FONT.textMedium, size: 7.6, colour: INK.ink, width: 360 });
  const right = `Effective ${longDate(snapshot.assignment.effectiveDate)}`;
  const w = textWidth(doc, right, { size: 7.6 });
  place(doc, right, PAGE.width - PAGE.right - w, y + 1, { size: 7.6, colour: INK.soft, width: w + 2 });
  rule(doc, y + 16, INK.rule);
}

function footer(ctx: ReportContext, pageNumber: number, pageCount: number): void {
  const { doc } = ctx;
  const y = PAGE.height - 46;
  rule(doc, y, INK.rule);
  place(doc, 'SHA-256', PAGE.left, y + 8, { font: FONT.textMedium, size: 6.4, colour: INK.faint, width: 40, characterSpacing: 0.4 });
  place(doc, ctx.sha256, PAGE.left + 36, y + 7.6, { font: FONT.figures, size: 6.6, colour: INK.soft, width: 300 });
  const label = `Page ${pageNumber} of ${pageCount}`;
  const w = textWidth(doc, label, { font: FONT.textMedium, size: 7.8 });
  place(doc, label, PAGE.width - PAGE.right - w, y + 7, { font: FONT.textMedium, size: 7.8, colour: INK.ink, width: w + 2 });
  place(doc, `Prepared with Compline for ${ctx.snapshot.clientName}. Read with the cautions and conditions it states.`, PAGE.left, y + 18, { size: 6.4, colour: INK.faint, width: 400 });
}

/** Writes the head and footer on every buffered page. The bottom margin is lifted while the footer
 * is drawn, or pdfkit would start a new page for text below it. */
export function writePageFurniture(ctx: ReportContext): void {
  const { doc } = ctx;
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const margins = { ...doc.page.margins };
    doc.page.margins.bottom = 0;
    doc.page.margins.top = 0;
    if (i > range.start) runningHead(ctx);
    footer(ctx, i - range.start + 1, range.count);
    doc.page.margins = margins;
  }
}

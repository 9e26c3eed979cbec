// The first page: masthead, the subject's address, the value panel (opinion of value, the
// regression estimate with its interval, R² and n, and a ruler that sets them side by side), the
// assignment's facts and where to check the copy.
import { FONT } from './fonts';
import { decimal, longDate, money, orDash } from './format';
import { eyebrow, facts, oneLine, place, rule, textHeight, textWidth, type ReportContext } from './layout';
import { subjectGroup } from '../../../contracts/report-facts';
import { ACCENT, CONTENT_WIDTH, INK, PAGE, STATE } from './theme';
import { valueRuler } from './value-ruler';

/** Compline's mark: three sales and the line fitted through them. */
export function brandMark(doc: PDFKit.PDFDocument, x: number, y: number, size: number): void {
  const k = size / 32;
  doc.save().translate(x, y).scale(k);
  doc.roundedRect(0, 0, 32, 32, 7).fill(INK.ink);
  doc.moveTo(5.5, 24).lineTo(26.5, 9).lineWidth(2.6).lineCap('round').strokeColor(ACCENT.ochre).stroke();
  for (const [cx, cy] of [[10, 23.4], [16.2, 13.6], [22.4, 15.4]]) doc.circle(cx, cy, 2.5).fill('#ffffff');
  doc.restore();
}

function masthead(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  const y = 40;
  brandMark(doc, PAGE.left, y, 22);
  place(doc, 'Compline', PAGE.left + 29, y + 3.5, { font: FONT.textBold, size: 13, width: 100 });
  const right = `Appraisal report  ·  Version ${snapshot.versionNumber}`;
  const w = textWidth(doc, right, { font: FONT.textMedium, size: 8.5 });
  place(doc, right, PAGE.width - PAGE.right - w, y + 2, { font: FONT.textMedium, size: 8.5, colour: INK.ink, width: w + 2 });
  const signed = `Signed ${longDate(snapshot.signedAt)} by ${snapshot.signer.name}`;
  const sw = textWidth(doc, signed, { size: 7.6 });
  place(doc, signed, PAGE.width - PAGE.right - sw, y + 13, { size: 7.6, colour: INK.soft, width: sw + 2 });
  rule(doc, y + 32, INK.ink, PAGE.left, PAGE.width - PAGE.right, 1.2);
}

function addressBlock(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  let y = 88;
  eyebrow(doc, 'Subject property', PAGE.left, y, ACCENT.ochreDeep);
  y += 11;
  y += place(doc, snapshot.assignment.subjectAddress, PAGE.left, y, { font: FONT.textBold, size: 22, lineGap: 0 });
  const where = [snapshot.subject.neighbourhood, `prepared for ${snapshot.clientName}`, `by ${snapshot.firmName}`].filter(Boolean).join('  ·  ');
  y += place(doc, where, PAGE.left, y + 1, { size: 9.5, colour: INK.soft }) + 14;
  doc.y = y;
}

function valuePanel(ctx: ReportContext): void {
  const { doc, snapshot, units } = ctx;
  const top = doc.y;
  const group = subjectGroup(snapshot);
  const regression = snapshot.grid.regression ?? (group?.prediction ? { ...group.prediction, neighbourhood: group.neighbourhood } : null);
  const hasRuler = regression !== null || snapshot.grid.adjustedRange !== null || snapshot.opinionOfValue !== null;
  const height = hasRuler ? 142 : 92;
  doc.save().rect(PAGE.left, top, CONTENT_WIDTH, height).fill(INK.tint).restore();
  doc.save().rect(PAGE.left, top, 4, height).fill(ACCENT.ochre).restore();
  const lx = PAGE.left + 20;
  const rx = PAGE.left + 262;
  eyebrow(doc, 'Opinion of value', lx, top + 14, ACCENT.ochreDeep);
  if (snapshot.opinionOfValue !== null) {
    place(doc, money(snapshot.opinionOfValue, units.currency), lx, top + 26, { font: FONT.figuresMedium, size: 28, width: 230 });
  } else {
    place(doc, 'Not reached', lx, top + 30, { font: FONT.textBold, size: 20, colour: INK.soft, width: 230 });
  }
  place(doc, `As of ${longDate(snapshot.assignment.effectiveDate)}, the effective date`, lx, top + 64, { size: 8.5, colour: INK.soft, width: 230 });

  doc.save().moveTo(rx - 16, top + 14).lineTo(rx - 16, top + 78).lineWidth(0.6).strokeColor(INK.rule).stroke().restore();
  eyebrow(doc, 'Regression estimate at the subject', rx, top + 14, INK.faint, 230);
  if (regression) {
    place(doc, money(regression.estimate, units.currency), rx, top + 26, { font: FONT.figuresMedium, size: 16, width: 230 });
    place(doc, `95% prediction interval ${money(regression.lower, units.currency)} to ${money(regression.upper, units.currency)}`, rx, top + 47, { font: FONT.figures, size: 7.8, colour: INK.ink, width: 236 });
    const stats = `R² ${decimal(group?.fit?.rSquared ?? null)}  ·  n = ${group?.n ?? 0}  ·  ${regression.neighbourhood}`;
    place(doc, stats, rx, top + 59, { font: FONT.figures, size: 7.8, colour: INK.soft, width: 236 });
  } else {
    const why = group?.refusal?.message ?? 'No price-on-floor-area fit reached the subject, so there is no estimate to show.';
    place(doc, why, rx, top + 27, { size: 8.5, colour: INK.soft, width: 230 });
    if (group) place(doc, `R² ${decimal(group.fit?.rSquared ?? null)}  ·  n = ${group.n}`, rx, top + 59, { font: FONT.figures, size: 7.8, colour: INK.soft, width: 230 });
  }
  if (group?.prediction?.extrapolated) {
    place(doc, 'The subject lies outside the sales’ floor-area range: the estimate extrapolates.', rx, top + 70, { size: 7, colour: STATE.rust, width: 236 });
  }
  if (hasRuler) valueRuler(doc, { left: lx, top: top + 90, width: CONTENT_WIDTH - 40 }, {
    interval: regression ? [regression.lower, regression.upper] : null,
    estimate: regression?.estimate ?? null,
    adjustedRange: snapshot.grid.adjustedRange,
    opinion: snapshot.opinionOfValue,
    currency: units.currency,
  });
  doc.y = top + height + 16;
}

function assignmentFacts(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  const a = snapshot.assignment;
  facts(
    doc,
    [
      { label: 'Client', value: snapshot.clientName },
      { label: 'Intended use', value: a.intendedUse },
      { label: 'Loan reference', value: orDash(a.loanReference), figure: true },
      { label: 'Appraisal firm', value: snapshot.firmName },
      { label: 'Signed by', value: `${snapshot.signer.name}, licence ${snapshot.signer.licenceNumber} (${snapshot.signer.jurisdiction})` },
      { label: 'Signed on', value: longDate(snapshot.signedAt) },
      { label: 'Effective date', value: longDate(a.effectiveDate) },
      { label: 'Report version', value: `Version ${snapshot.versionNumber}`, figure: true },
      { label: 'Currency and unit', value: `${a.currency}, ${a.areaUnit === 'sqft' ? 'square feet' : 'square metres'}` },
    ],
    3,
  );
}

function verifyNote(ctx: ReportContext): void {
  const { doc } = ctx;
  const text = `This copy is version ${ctx.snapshot.versionNumber}, frozen when signed. Its SHA-256 fingerprint is printed at the foot of every page. To confirm that a report with this fingerprint was signed, and what it concluded, open:`;
  const inner = CONTENT_WIDTH - 24;
  const h = textHeight(doc, text, { size: 7.8, width: inner });
  const y = doc.y + 2;
  doc.save().rect(PAGE.left, y, CONTENT_WIDTH, h + 26).lineWidth(0.6).strokeColor(INK.rule).stroke().restore();
  place(doc, text, PAGE.left + 12, y + 7, { size: 7.8, colour: INK.soft, width: inner });
  oneLine(doc, ctx.verifyUrl, PAGE.left + 12, y + 9 + h, inner, { font: FONT.figures, size: 7.6, colour: INK.ink });
  doc.y = y + h + 26 + 6;
}

export function openingSection(ctx: ReportContext): void {
  masthead(ctx);
  addressBlock(ctx);
  valuePanel(ctx);
  assignmentFacts(ctx);
  verifyNote(ctx);
}

// The closing statements: assumptions and hypothetical conditions, limiting conditions, the
// cautions word for word, and the certification with the signer's name, licence and jurisdiction.
import { FONT } from './fonts';
import { longDate } from './format';
import { ensureSpace, eyebrow, list, oneLine, paragraph, place, rule, sectionTitle, subheading, textHeight, type ReportContext } from './layout';
import { ACCENT, CONTENT_WIDTH, INK, PAGE } from './theme';

function statedOrNone(ctx: ReportContext, title: string, text: string, none: string): void {
  subheading(ctx.doc, title, 40);
  const stated = text.trim();
  paragraph(ctx.doc, stated || none, { size: 9, colour: stated ? INK.ink : INK.soft });
}

export function assumptionsSection(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  sectionTitle(doc, 'Assumptions and conditions', 'What the opinion of value rests on, as stated by the appraiser when signing.');
  statedOrNone(ctx, 'Extraordinary assumptions', snapshot.extraordinaryAssumptions, 'None stated.');
  statedOrNone(ctx, 'Hypothetical conditions', snapshot.hypotheticalConditions, 'None stated.');
  subheading(doc, 'Limiting conditions', 40);
  list(doc, snapshot.limitingConditions, true, { size: 9 });
}

/** The cautions in a ruled box, word for word. */
export function cautionsBlock(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  const width = CONTENT_WIDTH - 40;
  const heights = snapshot.cautions.map((c) => textHeight(doc, c, { size: 9, width, lineGap: 1.8 }));
  const total = 30 + heights.reduce((t, h) => t + h + 7, 0) + 6;
  ensureSpace(doc, total + 20);
  doc.y += 10;
  const top = doc.y;
  doc.save().rect(PAGE.left, top, CONTENT_WIDTH, total).lineWidth(1).strokeColor(ACCENT.ochre).stroke().restore();
  doc.save().rect(PAGE.left, top, CONTENT_WIDTH, 22).fill(ACCENT.ochreWash).restore();
  place(doc, 'Cautions', PAGE.left + 14, top + 6, { font: FONT.textBold, size: 10, colour: INK.ink, width: 200 });
  let y = top + 30;
  snapshot.cautions.forEach((caution, i) => {
    place(doc, String(i + 1), PAGE.left + 16, y, { font: FONT.figuresMedium, size: 9, colour: ACCENT.ochreDeep, width: 14 });
    y += place(doc, caution, PAGE.left + 32, y, { size: 9, width, lineGap: 1.8 }) + 7;
  });
  doc.y = top + total + 10;
}

function signatureBlock(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  ensureSpace(doc, 150);
  doc.y += 12;
  const top = doc.y;
  const half = CONTENT_WIDTH / 2 - 10;
  rule(doc, top + 30, INK.ink, PAGE.left, PAGE.left + half, 0.8);
  place(doc, snapshot.signer.name, PAGE.left, top + 10, { font: FONT.textBold, size: 13, width: half });
  eyebrow(doc, 'Signed electronically in Compline', PAGE.left, top + 35, INK.faint, half);
  const lines = [
    `Licence or certificate ${snapshot.signer.licenceNumber}`,
    `Issued by ${snapshot.signer.jurisdiction}`,
    `${snapshot.firmName}`,
    `Signed ${longDate(snapshot.signedAt)}`,
    `Effective date ${longDate(snapshot.assignment.effectiveDate)}`,
  ];
  let y = top + 47;
  for (const line of lines) y += place(doc, line, PAGE.left, y, { size: 8.6, colour: INK.soft, width: half }) + 1;

  const rx = PAGE.left + half + 20;
  eyebrow(doc, 'Check this copy', rx, top + 10, ACCENT.ochreDeep, half);
  const verify = `Report version ${snapshot.versionNumber} was frozen when signed. Its SHA-256 fingerprint is at the foot of every page. Open the address below to confirm that a report with this fingerprint was signed and what it concluded.`;
  const ry = top + 22 + place(doc, verify, rx, top + 22, { size: 8, colour: INK.soft, width: half });
  const urlY = Math.max(y, ry) + 10;
  doc.save().rect(PAGE.left, urlY, CONTENT_WIDTH, 20).fill(INK.tint).restore();
  oneLine(doc, ctx.verifyUrl, PAGE.left + 10, urlY + 6.5, CONTENT_WIDTH - 20, { font: FONT.figures, size: 7.6, colour: INK.ink });
  doc.y = urlY + 30;
}

export function certificationSection(ctx: ReportContext): void {
  const { doc, snapshot } = ctx;
  // The statements and the signature under them stay on one page when they can.
  const statements = snapshot.certification.reduce((t, c) => t + textHeight(doc, c, { size: 9, width: CONTENT_WIDTH - 18 }) + 4, 0);
  const together = 70 + statements + 170;
  sectionTitle(doc, 'Certification', `${snapshot.signer.name} certifies that:`, together < PAGE.height - PAGE.top - PAGE.bottom ? together : 140);
  list(doc, snapshot.certification, true, { size: 9 });
  signatureBlock(ctx);
}

// Drawing helpers shared by the report's sections: every piece of text goes through `printable`, and
// blocks move to a fresh page when they would not fit above the footer.
import type { ReportSnapshot } from '../../../contracts/report';
import { FONT, printable, type FontName } from './fonts';
import type { Units } from './format';
import { ACCENT, CONTENT_WIDTH, INK, PAGE } from './theme';

export interface ReportContext {
  doc: PDFKit.PDFDocument;
  snapshot: ReportSnapshot;
  units: Units;
  sha256: string;
  verifyUrl: string;
}

export interface TextStyle {
  font?: FontName;
  size?: number;
  colour?: string;
  width?: number;
  align?: 'left' | 'right' | 'center' | 'justify';
  lineGap?: number;
  characterSpacing?: number;
  strike?: boolean;
}

const bottomLimit = () => PAGE.height - PAGE.bottom;

export function newPage(doc: PDFKit.PDFDocument): void {
  doc.addPage();
  doc.x = PAGE.left;
  doc.y = PAGE.top;
}

/** Starts a new page when `height` points would not fit above the footer. */
export function ensureSpace(doc: PDFKit.PDFDocument, height: number): void {
  if (doc.y + height > bottomLimit()) newPage(doc);
}

function applyStyle(doc: PDFKit.PDFDocument, style: TextStyle): void {
  doc.font(style.font ?? FONT.text).fontSize(style.size ?? 9.5).fillColor(style.colour ?? INK.ink);
}

export function textHeight(doc: PDFKit.PDFDocument, text: string, style: TextStyle = {}): number {
  applyStyle(doc, style);
  return doc.heightOfString(printable(text), { width: style.width ?? CONTENT_WIDTH, lineGap: style.lineGap ?? 1.5, characterSpacing: style.characterSpacing, features: style.characterSpacing ? NO_KERNING : undefined });
}

export function textWidth(doc: PDFKit.PDFDocument, text: string, style: TextStyle = {}): number {
  applyStyle(doc, style);
  return doc.widthOfString(printable(text), { characterSpacing: style.characterSpacing, features: style.characterSpacing ? NO_KERNING : undefined });
}

// Letter-spaced labels are set without kerning: kerned pairs plus extra spacing read to text
// extractors as a gap inside the word ("PROPERT Y").
const NO_KERNING = { kern: false } as unknown as PDFKit.Mixins.TextOptions['features'];

/** Text at a fixed position; returns its height. Does not move the flow. */
export function place(doc: PDFKit.PDFDocument, text: string, x: number, y: number, style: TextStyle = {}): number {
  applyStyle(doc, style);
  const width = style.width ?? CONTENT_WIDTH;
  const options = { width, align: style.align, lineGap: style.lineGap ?? 1.5, characterSpacing: style.characterSpacing, strike: style.strike, features: style.characterSpacing ? NO_KERNING : undefined };
  const safe = printable(text);
  const height = doc.heightOfString(safe, options);
  const savedY = doc.y;
  const savedX = doc.x;
  doc.text(safe, x, y, options);
  doc.x = savedX;
  doc.y = savedY;
  return height;
}

/** A flowing paragraph at the left margin (pdfkit breaks long ones across pages). */
export function paragraph(doc: PDFKit.PDFDocument, text: string, style: TextStyle = {}, gapAfter = 6): void {
  applyStyle(doc, style);
  const options = { width: style.width ?? CONTENT_WIDTH, align: style.align, lineGap: style.lineGap ?? 1.5 };
  ensureSpace(doc, Math.min(doc.heightOfString(printable(text), options), 40));
  doc.text(printable(text), PAGE.left, doc.y, options);
  doc.x = PAGE.left;
  doc.y += gapAfter;
}

/** A small upper-case label. */
export function eyebrow(doc: PDFKit.PDFDocument, text: string, x: number, y: number, colour: string = INK.faint, width = CONTENT_WIDTH): number {
  return place(doc, text.toUpperCase(), x, y, { font: FONT.textMedium, size: 6.8, colour, characterSpacing: 0.5, width });
}

/** Text that must stay on one line (a URL, a fingerprint): set smaller when it would not fit. */
export function oneLine(doc: PDFKit.PDFDocument, text: string, x: number, y: number, width: number, style: TextStyle): number {
  const size = style.size ?? 9.5;
  const natural = textWidth(doc, text, { ...style, size });
  const fitted = natural > width ? (size * width) / natural - 0.05 : size;
  return place(doc, text, x, y, { ...style, size: fitted, width: width + 4 });
}

/** A section opening: an ochre tick, the title, and an optional line saying what the section holds. */
export function sectionTitle(doc: PDFKit.PDFDocument, title: string, lede?: string, keepWith = 90): void {
  ensureSpace(doc, keepWith);
  if (doc.y > PAGE.top + 1) doc.y += 12;
  const y = doc.y;
  doc.save().rect(PAGE.left, y + 2, 14, 3).fill(ACCENT.ochre).restore();
  const h = place(doc, title, PAGE.left + 22, y - 4, { font: FONT.textBold, size: 14, colour: INK.ink });
  doc.y = y - 4 + h + 3;
  if (lede) {
    const lh = place(doc, lede, PAGE.left + 22, doc.y, { size: 8.5, colour: INK.soft, width: CONTENT_WIDTH - 22 });
    doc.y += lh;
  }
  doc.y += 6;
  rule(doc, doc.y, INK.rule);
  doc.y += 8;
}

export function subheading(doc: PDFKit.PDFDocument, text: string, keepWith = 50): void {
  ensureSpace(doc, keepWith);
  doc.y += 4;
  const h = place(doc, text, PAGE.left, doc.y, { font: FONT.textMedium, size: 10.5, colour: INK.ink });
  doc.y += h + 4;
}

export function rule(doc: PDFKit.PDFDocument, y: number, colour: string = INK.rule, x0: number = PAGE.left, x1: number = PAGE.width - PAGE.right, width = 0.6): void {
  doc.save().moveTo(x0, y).lineTo(x1, y).lineWidth(width).strokeColor(colour).stroke().restore();
}

export interface Fact {
  label: string;
  value: string;
  figure?: boolean;
}

/** Label-over-value facts in equal columns, row by row. */
export function facts(doc: PDFKit.PDFDocument, items: readonly Fact[], columns: number, x = PAGE.left, width = CONTENT_WIDTH): void {
  const gap = 14;
  const colWidth = (width - gap * (columns - 1)) / columns;
  for (let i = 0; i < items.length; i += columns) {
    const row = items.slice(i, i + columns);
    const labelHeights = row.map((f) => textHeight(doc, f.label.toUpperCase(), { font: FONT.textMedium, size: 6.8, width: colWidth, characterSpacing: 0.5 }));
    const labelHeight = Math.max(...labelHeights);
    const heights = row.map((f) => textHeight(doc, f.value, { font: f.figure ? FONT.figures : FONT.text, size: 9.5, width: colWidth }));
    const rowHeight = labelHeight + 3 + Math.max(...heights) + 8;
    ensureSpace(doc, rowHeight);
    const y = doc.y;
    row.forEach((f, j) => {
      const cx = x + j * (colWidth + gap);
      eyebrow(doc, f.label, cx, y, INK.faint, colWidth);
      place(doc, f.value, cx, y + labelHeight + 3, { font: f.figure ? FONT.figures : FONT.text, size: 9.5, width: colWidth });
    });
    doc.y = y + rowHeight;
  }
}

/** A list with numbers or bullets hanging in the left margin of the text. */
export function list(doc: PDFKit.PDFDocument, items: readonly string[], numbered: boolean, style: TextStyle = {}): void {
  const indent = 18;
  const width = (style.width ?? CONTENT_WIDTH) - indent;
  items.forEach((item, i) => {
    const h = textHeight(doc, item, { ...style, width });
    ensureSpace(doc, Math.min(h, 60) + 4);
    const y = doc.y;
    place(doc, numbered ? `${i + 1}.` : '•', PAGE.left, y, { ...style, font: numbered ? FONT.figures : FONT.text, colour: INK.faint, width: indent });
    applyStyle(doc, style);
    doc.text(printable(item), PAGE.left + indent, y, { width, lineGap: style.lineGap ?? 1.5 });
    doc.x = PAGE.left;
    doc.y += 4;
  });
}

// A plain ruled table: upper-case column heads, figures in the monospaced face, a note line under a
// row when it needs one, struck-through rows for excluded sales, and the head repeated after a page
// break.
import { FONT, type FontName } from './fonts';
import { ensureSpace, place, rule, textHeight } from './layout';
import { FLAG_RING, INK, PAGE } from './theme';

export interface Column {
  header: string;
  width: number;
  align?: 'left' | 'right';
  figure?: boolean;
}

export interface TableRow {
  cells: string[];
  /** A row that only names the group of rows below it (cells are then ignored). */
  heading?: string;
  /** Smaller text under the row, across the whole table. */
  note?: string;
  noteColour?: string;
  struck?: boolean;
  /** Draws the magenta ring of a flagged sale before the first cell. */
  flagged?: boolean;
  /** A faint band behind the row. */
  shaded?: boolean;
  bold?: boolean;
  /** A colour per cell, to single out a figure (an adjustment over its guideline, say). */
  cellColours?: ReadonlyArray<string | undefined>;
}

const PAD_X = 4;
const PAD_Y = 4;
const SIZE = 8;
const NOTE_SIZE = 7.4;
const MARK_GUTTER = 11;

function headerRow(doc: PDFKit.PDFDocument, columns: readonly Column[], x0: number, gutter: number): void {
  const y = doc.y;
  let x = x0 + gutter;
  const heights = columns.map((c, i) => {
    const w = c.width - PAD_X * 2 - (i === 0 ? gutter : 0);
    const h = textHeight(doc, c.header.toUpperCase(), { font: FONT.textMedium, size: 6.6, width: w, characterSpacing: 0.5 });
    return h;
  });
  const height = Math.max(...heights);
  columns.forEach((c, i) => {
    const w = c.width - (i === 0 ? gutter : 0);
    const h = heights[i];
    place(doc, c.header.toUpperCase(), x + PAD_X, y + height - h, { font: FONT.textMedium, size: 6.6, colour: INK.faint, width: w - PAD_X * 2, align: c.align ?? 'left', characterSpacing: 0.5 });
    x += w;
  });
  doc.y = y + height + 4;
  rule(doc, doc.y, INK.ink, x0, x0 + columns.reduce((t, c) => t + c.width, 0), 0.8);
  doc.y += 1;
}

function groupHeading(doc: PDFKit.PDFDocument, text: string, x0: number, width: number): void {
  ensureSpace(doc, 40);
  const y = doc.y + 6;
  place(doc, text, x0 + PAD_X, y, { font: FONT.textBold, size: 8, colour: INK.ink, width: width - PAD_X * 2 });
  doc.y = y + 13;
  rule(doc, doc.y, INK.ruleStrong, x0, x0 + width, 0.5);
}

function cellFont(c: Column, bold: boolean | undefined): FontName {
  if (c.figure) return bold ? FONT.figuresMedium : FONT.figures;
  return bold ? FONT.textMedium : FONT.text;
}

export function table(doc: PDFKit.PDFDocument, columns: readonly Column[], rows: readonly TableRow[], x0: number = PAGE.left, size: number = SIZE): void {
  const gutter = rows.some((r) => r.flagged) ? MARK_GUTTER : 0;
  const totalWidth = columns.reduce((t, c) => t + c.width, 0);
  ensureSpace(doc, 60);
  headerRow(doc, columns, x0, gutter);
  for (const row of rows) {
    if (row.heading) {
      groupHeading(doc, row.heading, x0, totalWidth);
      continue;
    }
    const widths = columns.map((c, i) => c.width - PAD_X * 2 - (i === 0 ? gutter : 0));
    const cellHeights = row.cells.map((cell, i) => textHeight(doc, cell, { font: cellFont(columns[i], row.bold), size, width: widths[i] }));
    const noteHeight = row.note ? textHeight(doc, row.note, { font: FONT.textItalic, size: NOTE_SIZE, width: totalWidth - gutter - PAD_X * 2 }) + 2 : 0;
    const height = Math.max(...cellHeights) + noteHeight + PAD_Y * 2;
    if (doc.y + height > PAGE.height - PAGE.bottom) {
      ensureSpace(doc, height + 40);
      headerRow(doc, columns, x0, gutter);
    }
    const y = doc.y;
    if (row.shaded) doc.save().rect(x0, y, totalWidth, height).fill(INK.tint).restore();
    let x = x0 + gutter;
    row.cells.forEach((cell, i) => {
      const c = columns[i];
      const w = c.width - (i === 0 ? gutter : 0);
      place(doc, cell, x + PAD_X, y + PAD_Y, { font: cellFont(c, row.bold), size, colour: row.struck ? INK.faint : (row.cellColours?.[i] ?? INK.ink), width: w - PAD_X * 2, align: c.align ?? 'left', strike: row.struck });
      x += w;
    });
    if (row.flagged) {
      doc.save().circle(x0 + 6, y + PAD_Y + 4.2, 3.2).lineWidth(1.3).strokeColor(FLAG_RING).stroke().restore();
    }
    if (row.note) {
      place(doc, row.note, x0 + gutter + PAD_X, y + PAD_Y + Math.max(...cellHeights) + 2, { font: FONT.textItalic, size: NOTE_SIZE, colour: row.noteColour ?? INK.soft, width: totalWidth - gutter - PAD_X * 2 });
    }
    doc.y = y + height;
    rule(doc, doc.y, INK.rule, x0, x0 + totalWidth, 0.5);
  }
  doc.y += 6;
}

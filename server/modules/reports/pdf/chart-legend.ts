// The key to the price-on-floor-area chart, drawn with the same marks as the chart itself. Entries
// run left to right and wrap to a second line rather than past the margin.
import { FONT } from './fonts';
import { place, textWidth } from './layout';
import { ACCENT, FLAG_RING, INK, PAGE, RESIDUAL_STEPS } from './theme';

const LABEL = { size: 7, colour: INK.soft, font: FONT.text } as const;
const GAP = 14;
const LINE = 13;

interface Entry {
  /** Width of the mark drawn before the label. */
  markWidth: number;
  mark: (doc: PDFKit.PDFDocument, x: number, y: number) => void;
  label: string;
}

const ENTRIES: readonly Entry[] = [
  {
    markWidth: RESIDUAL_STEPS.length * 9 + 2,
    mark: (doc, x, y) => RESIDUAL_STEPS.forEach((colour, i) => doc.save().circle(x + 4 + i * 9, y, 3.2).fill(colour).restore()),
    label: 'Residual: teal below the line, rust above',
  },
  {
    markWidth: 12,
    mark: (doc, x, y) => doc.save().circle(x + 5, y, 2.6).fill(RESIDUAL_STEPS[3]).circle(x + 5, y, 5.2).lineWidth(1.4).strokeColor(FLAG_RING).stroke().restore(),
    label: 'Flagged sale',
  },
  {
    markWidth: 16,
    mark: (doc, x, y) => doc.save().moveTo(x, y).lineTo(x + 16, y).lineWidth(1.4).strokeColor(INK.ink).stroke().restore(),
    label: 'Fitted line',
  },
  {
    markWidth: 16,
    mark: (doc, x, y) => {
      doc.save().rect(x, y - 4, 16, 8).fill(INK.tintStrong).restore();
      doc.save().moveTo(x, y - 4).lineTo(x + 16, y - 4).moveTo(x, y + 4).lineTo(x + 16, y + 4).lineWidth(0.7).dash(2.5, { space: 2 }).strokeColor(INK.ruleStrong).stroke().undash().restore();
    },
    label: '95% prediction band',
  },
  {
    markWidth: 10,
    mark: (doc, x, y) => {
      doc.save().lineWidth(1.4).strokeColor(INK.ink).moveTo(x + 5, y - 5).lineTo(x + 5, y + 5).stroke().restore();
      doc.save().polygon([x + 5, y - 3.5], [x + 8.5, y], [x + 5, y + 3.5], [x + 1.5, y]).lineWidth(1).fillAndStroke('#ffffff', INK.ink).restore();
    },
    label: 'Estimate and interval at the subject',
  },
  {
    markWidth: 8,
    mark: (doc, x, y) => doc.save().polygon([x + 4, y - 4], [x + 8, y], [x + 4, y + 4], [x, y]).fill(ACCENT.ochre).restore(),
    label: 'Opinion of value',
  },
];

export function scatterLegend(doc: PDFKit.PDFDocument): void {
  const right = PAGE.width - PAGE.right;
  let x: number = PAGE.left;
  let y = doc.y + 6;
  for (const entry of ENTRIES) {
    const labelWidth = textWidth(doc, entry.label, LABEL);
    const width = entry.markWidth + 4 + labelWidth;
    if (x > PAGE.left && x + width > right) {
      x = PAGE.left;
      y += LINE;
    }
    entry.mark(doc, x, y);
    place(doc, entry.label, x + entry.markWidth + 4, y - 3.8, { ...LABEL, width: labelWidth + 2 });
    x += width + GAP;
  }
  doc.y = y + 12;
}

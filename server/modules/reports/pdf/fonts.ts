// The report's two typefaces, embedded from the fonts the app already ships: Public Sans for text,
// IBM Plex Mono for figures. The .woff files are used (pdfkit's .woff2 output renders invisibly in
// some viewers), unwrapped to plain font files first (see woff.ts). Only the latin subset is loaded,
// so text is first mapped onto that subset.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { woffToSfnt } from './woff';

const require = createRequire(import.meta.url);

export const FONT = {
  text: 'PublicSans',
  textMedium: 'PublicSans-Medium',
  textBold: 'PublicSans-Bold',
  textItalic: 'PublicSans-Italic',
  figures: 'PlexMono',
  figuresMedium: 'PlexMono-Medium',
} as const;
export type FontName = (typeof FONT)[keyof typeof FONT];

const FILES: Record<FontName, string> = {
  [FONT.text]: '@fontsource/public-sans/files/public-sans-latin-400-normal.woff',
  [FONT.textMedium]: '@fontsource/public-sans/files/public-sans-latin-600-normal.woff',
  [FONT.textBold]: '@fontsource/public-sans/files/public-sans-latin-700-normal.woff',
  [FONT.textItalic]: '@fontsource/public-sans/files/public-sans-latin-400-italic.woff',
  [FONT.figures]: '@fontsource/ibm-plex-mono/files/ibm-plex-mono-latin-400-normal.woff',
  [FONT.figuresMedium]: '@fontsource/ibm-plex-mono/files/ibm-plex-mono-latin-500-normal.woff',
};

let unwrapped: Map<string, Buffer> | null = null;

/** The font files, read and unwrapped once per process. */
function fontBytes(): Map<string, Buffer> {
  unwrapped ??= new Map(Object.entries(FILES).map(([name, file]) => [name, woffToSfnt(readFileSync(require.resolve(file)))]));
  return unwrapped;
}

export function registerFonts(doc: PDFKit.PDFDocument): void {
  for (const [name, bytes] of fontBytes()) doc.registerFont(name, bytes);
}

// The code points the latin subset carries (the subset's published unicode-range).
const LATIN_RANGES: ReadonlyArray<readonly [number, number]> = [
  [0x20, 0x7e], [0xa0, 0xff], [0x131, 0x131], [0x152, 0x153], [0x2bb, 0x2bc], [0x2c6, 0x2c6], [0x2da, 0x2da],
  [0x2dc, 0x2dc], [0x2000, 0x206f], [0x20ac, 0x20ac], [0x2122, 0x2122], [0x2212, 0x2212], [0x2215, 0x2215],
];

// Signs the subset lacks, written the way a reader would type them.
const STAND_INS: Record<string, string> = {
  '≥': '>=',
  '≤': '<=',
  '≠': '!=',
  '≈': '~',
  '→': '->',
  '←': '<-',
  '√': 'sqrt',
  '✓': 'yes',
  '✗': 'no',
  'ŷ': 'y',
  // Letters with a stroke have no decomposition to fall back on.
  'Ł': 'L',
  'ł': 'l',
  'Đ': 'D',
  'đ': 'd',
  'Ħ': 'H',
  'ħ': 'h',
  'Ŧ': 'T',
  'ŧ': 't',
  '\t': ' ',
};

const inSubset = (cp: number) => LATIN_RANGES.some(([lo, hi]) => cp >= lo && cp <= hi);

/** Text that the embedded latin fonts can draw: known signs get a typed stand-in, accented letters
 * outside the subset fall back to their base letter, and anything else is dropped rather than shown
 * as an empty box. Line breaks are kept. */
export function printable(text: string): string {
  let out = '';
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (ch === '\n' || inSubset(cp)) out += ch;
    else if (STAND_INS[ch] !== undefined) out += STAND_INS[ch];
    else out += [...ch.normalize('NFKD')].filter((c) => inSubset(c.codePointAt(0)!)).join('');
  }
  return out;
}

// The subject's characteristics and every sale considered. Excluded sales stay in the table, struck
// through, with the reason; flagged sales carry the magenta ring.
import { saleTypeLabels } from '../../../contracts/sales';
import { area, areaSymbol, count, decimal, money, orDash, shortDate } from './format';
import { facts, paragraph, sectionTitle, subheading, type ReportContext } from './layout';
import { flaggedSaleIds } from '../../../contracts/report-facts';
import { table, type Column, type TableRow } from './table';
import { INK, STATE } from './theme';

const rating = (v: number | null) => (v === null ? '—' : `${v} of 6 (1 is best)`);

export function subjectSection(ctx: ReportContext): void {
  const { doc, snapshot, units } = ctx;
  const s = snapshot.subject;
  sectionTitle(doc, 'The subject property', 'As recorded by the appraiser for this assignment.');
  facts(
    doc,
    [
      { label: 'Neighbourhood', value: orDash(s.neighbourhood) },
      { label: 'Floor area', value: area(s.floorArea, units.areaUnit), figure: true },
      { label: 'Lot size', value: area(s.lotSize, units.areaUnit), figure: true },
      { label: 'Year built', value: s.yearBuilt === null ? '—' : String(s.yearBuilt), figure: true },
      { label: 'Bedrooms', value: count(s.bedrooms), figure: true },
      { label: 'Bathrooms', value: s.bathrooms === null ? '—' : decimal(s.bathrooms, s.bathrooms % 1 === 0 ? 0 : 1), figure: true },
      { label: 'Garage spaces', value: count(s.garageSpaces), figure: true },
      { label: 'Location', value: s.lat !== null && s.lon !== null ? `${s.lat.toFixed(5)}, ${s.lon.toFixed(5)}` : '—', figure: true },
      { label: 'Condition', value: rating(s.condition) },
      { label: 'Quality', value: rating(s.quality) },
    ],
    4,
  );
  if (s.notes && s.notes.trim()) {
    subheading(doc, 'Appraiser’s notes on the subject', 30);
    paragraph(doc, s.notes, { size: 9, colour: INK.soft });
  }
}

/** Where the sale data came from, counted once per source rather than repeated on every row. */
function sourceSummary(sales: ReportContext['snapshot']['sales']): string {
  const counts = new Map<string, number>();
  for (const s of sales) counts.set(s.dataSource?.trim() || 'source not recorded', (counts.get(s.dataSource?.trim() || 'source not recorded') ?? 0) + 1);
  const verified = sales.filter((s) => s.verificationNote?.trim()).length;
  const parts = [...counts].map(([source, n]) => `${source} (${n})`);
  return `${parts.length === 1 ? 'Source' : 'Sources'}: ${parts.join('; ')}. ${verified} of ${sales.length} sales carry a verification note.`;
}

export function salesSection(ctx: ReportContext): void {
  const { doc, snapshot, units } = ctx;
  const flagged = flaggedSaleIds(snapshot);
  const subjectHood = snapshot.subject.neighbourhood;
  const sales = [...snapshot.sales].sort((a, b) => {
    const hoodA = a.neighbourhood === subjectHood ? '' : (a.neighbourhood ?? '~');
    const hoodB = b.neighbourhood === subjectHood ? '' : (b.neighbourhood ?? '~');
    return hoodA.localeCompare(hoodB) || Number(b.inGrid) - Number(a.inGrid) || b.saleDate.localeCompare(a.saleDate);
  });
  const excluded = sales.filter((s) => s.excluded).length;
  const inGrid = sales.filter((s) => s.inGrid && !s.excluded).length;
  const lede = `${sales.length} sale${sales.length === 1 ? '' : 's'} considered, ${inGrid} carried into the grid, ${excluded} excluded (struck through, with the reason). A magenta ring marks a sale the fit flagged.`;
  sectionTitle(doc, 'Sales considered', lede);
  if (sales.length === 0) {
    paragraph(doc, 'No sales were recorded for this assignment.', { colour: INK.soft });
    return;
  }
  const columns: Column[] = [
    { header: 'Address', width: 132 },
    { header: 'Sold', width: 66, figure: true },
    { header: 'Price', width: 62, align: 'right', figure: true },
    { header: 'Floor area', width: 60, align: 'right', figure: true },
    { header: `Per ${areaSymbol(units.areaUnit)}`, width: 46, align: 'right', figure: true },
    { header: 'Sale type', width: 92 },
    { header: 'Role', width: 46 },
  ];
  const oneSource = new Set(sales.map((s) => s.dataSource?.trim() || null)).size === 1;
  const rows: TableRow[] = [];
  let hood: string | null | undefined;
  for (const s of sales) {
    if (s.neighbourhood !== hood) {
      hood = s.neighbourhood;
      const n = sales.filter((x) => x.neighbourhood === hood).length;
      rows.push({ cells: [], heading: `${hood ?? 'No neighbourhood'}${hood === subjectHood ? ' (the subject’s neighbourhood)' : ''}: ${n} sale${n === 1 ? '' : 's'}` });
    }
    const notes: string[] = [];
    if (s.excluded) notes.push(`Excluded: ${s.exclusionReason ?? 'no reason recorded'}`);
    if (s.sellerConcessions > 0) notes.push(`Seller concessions ${money(s.sellerConcessions, units.currency)}`);
    if (!oneSource && s.dataSource?.trim()) notes.push(`Source: ${s.dataSource.trim()}`);
    if (s.verificationNote?.trim()) notes.push(`Verified: ${s.verificationNote.trim()}`);
    rows.push({
      cells: [
        s.address,
        shortDate(s.saleDate),
        money(s.salePrice, units.currency),
        area(s.floorArea, units.areaUnit),
        money(s.salePrice / s.floorArea, units.currency),
        saleTypeLabels[s.saleType],
        s.excluded ? 'Set aside' : s.inGrid ? 'Grid' : 'Fit',
      ],
      note: notes.length ? notes.join('  ·  ') : undefined,
      noteColour: s.excluded ? STATE.rust : INK.soft,
      struck: s.excluded,
      flagged: flagged.has(s.id),
      shaded: s.inGrid && !s.excluded,
    });
  }
  table(doc, columns, rows, undefined, 7.8);
  paragraph(doc, `Role: Grid = adjusted in the grid (shaded); Fit = used in the market analysis only; Set aside = excluded from both. ${sourceSummary(sales)}`, { size: 7.4, colour: INK.faint });
}

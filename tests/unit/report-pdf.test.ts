import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { formatMoney } from '../../server/analysis/format-money';
import { CAUTIONS } from '../../server/contracts/report-text';
import type { ReportSnapshot } from '../../server/contracts/report';
import { printable } from '../../server/modules/reports/pdf/fonts';
import { perArea, signedMoney } from '../../server/modules/reports/pdf/format';
import { renderReportPdf } from '../../server/modules/reports/pdf/report-pdf';
import { predictionHalfWidth } from '../../server/modules/reports/pdf/scatter-chart';
import { buildReportSnapshot, reportFingerprint, thinReportSnapshot } from '../factories/report-snapshot';

// Rendered files stay in test-output/pdf/ (ignored by git) so that a person can look at them.
const OUT = join(process.cwd(), 'test-output', 'pdf');

interface Rendered {
  snapshot: ReportSnapshot;
  sha256: string;
  pdfPath: string;
  pages: string[];
  /** All text, whitespace collapsed, for phrases that wrap across lines. */
  flat: string;
}

const normalise = (text: string) => text.replace(/-\n(?=\p{Ll})/gu, '').replace(/\s+/g, ' ').trim();

async function renderToDisk(name: string, snapshot: ReportSnapshot): Promise<Rendered> {
  const sha256 = reportFingerprint(snapshot);
  const pdf = await renderReportPdf(snapshot, sha256, { verifyUrl: `http://127.0.0.1:5173/verify/${sha256}` });
  mkdirSync(OUT, { recursive: true });
  for (const old of readdirSync(OUT).filter((f) => f.startsWith(`${name}-`) && f.endsWith('.png'))) rmSync(join(OUT, old));
  const pdfPath = join(OUT, `${name}.pdf`);
  writeFileSync(pdfPath, pdf);
  execFileSync('pdftoppm', ['-png', '-r', '60', pdfPath, join(OUT, name)]);
  const text = execFileSync('pdftotext', ['-enc', 'UTF-8', pdfPath, '-'], { encoding: 'utf8' });
  const pages = text.split('\f').filter((p) => p.trim().length > 0);
  return { snapshot, sha256, pdfPath, pages, flat: normalise(text) };
}

function pdfInfo(pdfPath: string): Record<string, string> {
  const out = execFileSync('pdfinfo', ['-enc', 'UTF-8', pdfPath], { encoding: 'utf8' });
  return Object.fromEntries(out.split('\n').filter((l) => l.includes(':')).map((l) => [l.slice(0, l.indexOf(':')).trim(), l.slice(l.indexOf(':') + 1).trim()]));
}

describe('the signed report as a PDF', () => {
  let report: Rendered;
  beforeAll(async () => {
    report = await renderToDisk('report-sample', buildReportSnapshot());
  });

  it('carries the title, fingerprint, signer and maker in its metadata, on US Letter', () => {
    const info = pdfInfo(report.pdfPath);
    expect(info.Title).toBe('Appraisal report — 14 Lantern Lane, Port Ellery');
    expect(info.Subject).toBe(`SHA-256 ${report.sha256}`);
    expect(info.Author).toBe('Maren Okafor');
    expect(info.Creator).toBe('Compline');
    expect(info['Page size']).toContain('612 x 792');
    expect(Number(info.Pages)).toBe(report.pages.length);
  });

  it('opens with the address, the opinion of value and the regression figures', () => {
    const { snapshot } = report;
    expect(snapshot.opinionOfValue).not.toBeNull();
    const first = normalise(report.pages[0]);
    expect(first).toContain('14 Lantern Lane, Port Ellery');
    expect(first).toContain(formatMoney(snapshot.opinionOfValue!, 'USD'));
    expect(first).toContain('November 15, 2026');
    expect(first).toContain('R²');
    expect(first).toContain('n = 14');
    expect(first).toContain(formatMoney(snapshot.grid.regression!.lower, 'USD'));
    expect(first).toContain(formatMoney(snapshot.grid.regression!.upper, 'USD'));
    expect(first).toContain('HM-2026-04417');
    expect(first).toContain(`/verify/${report.sha256}`);
  });

  it('prints the full fingerprint and "Page n of N" on every page', () => {
    const n = report.pages.length;
    expect(n).toBeGreaterThanOrEqual(4);
    report.pages.forEach((page, i) => {
      expect(page).toContain(report.sha256);
      expect(page).toContain(`Page ${i + 1} of ${n}`);
    });
  });

  it('states the three cautions word for word', () => {
    expect(report.snapshot.cautions).toEqual([...CAUTIONS]);
    for (const caution of CAUTIONS) expect(report.flat).toContain(normalise(caution));
    expect(report.flat).toContain('A flagged sale is a question, not a verdict');
    expect(report.flat).toContain('describes the sales given, not the market');
  });

  it('shows excluded sales with their reasons and how each flagged sale was handled', () => {
    const excluded = report.snapshot.sales.filter((s) => s.excluded);
    expect(excluded.length).toBe(2);
    for (const sale of excluded) expect(report.flat).toContain(normalise(sale.exclusionReason!));
    expect(report.flat).toContain('Flagged sales and how each was handled');
    expect(report.flat).toMatch(/KEPT Floor area confirmed at 3,120 ft²/);
    expect(report.flat).toMatch(/3 Gull Street .*NOT QUERIED/);
  });

  it('lists the grid with adjusted prices, the floor-area rate and the reconciliation', () => {
    const { grid } = report.snapshot;
    expect(grid.rows.length).toBe(4);
    for (const row of grid.rows) expect(report.flat).toContain(formatMoney(row.adjustedPrice, 'USD'));
    expect(report.flat).toContain(`${formatMoney(grid.rate.value!, 'USD')}/ft²`);
    expect(report.flat).toContain('Slope of the Quarry Hill fit');
    expect(report.flat).toContain(normalise(report.snapshot.reconciliationComment!));
  });

  it('ends with the certification naming the signer, licence and jurisdiction', () => {
    const last = normalise(report.pages.at(-1)!);
    expect(last).toContain('Maren Okafor');
    expect(last).toContain('CR-4471-NS');
    expect(last).toContain('Port Ellery Real Estate Appraisers Board');
    expect(last).toContain(`/verify/${report.sha256}`);
    expect(report.flat).toContain(normalise(report.snapshot.certification[0]));
  });

  it('embeds Public Sans and IBM Plex Mono, and no other font', () => {
    const lines = execFileSync('pdffonts', [report.pdfPath], { encoding: 'utf8' }).trim().split('\n').slice(2);
    expect(lines.length).toBeGreaterThanOrEqual(2);
    for (const line of lines) {
      expect(line).toMatch(/PublicSans|IBMPlexMono/);
      const columns = line.trim().split(/\s+/);
      expect(columns.at(-5)).toBe('yes');
    }
    expect(lines.some((l) => l.includes('IBMPlexMono'))).toBe(true);
  });

  it('draws the charts as vectors: the file holds no raster image', () => {
    const list = execFileSync('pdfimages', ['-list', report.pdfPath], { encoding: 'utf8' }).trim().split('\n');
    expect(list.length).toBe(2);
  });

  it('renders a first page that is not blank', async () => {
    const png = join(OUT, `report-sample-${String(1).padStart(String(report.pages.length).length, '0')}.png`);
    expect(statSync(png).size).toBeGreaterThan(20_000);
    const stats = await sharp(png).stats();
    expect(stats.channels[0].stdev).toBeGreaterThan(20);
  });

  it('renders the same bytes for the same signed version', async () => {
    const again = await renderReportPdf(report.snapshot, report.sha256, { verifyUrl: `http://127.0.0.1:5173/verify/${report.sha256}` });
    const first = await renderReportPdf(report.snapshot, report.sha256, { verifyUrl: `http://127.0.0.1:5173/verify/${report.sha256}` });
    expect(again.equals(first)).toBe(true);
  });
});

describe('a report with pieces missing', () => {
  let report: Rendered;
  beforeAll(async () => {
    report = await renderToDisk('report-thin', thinReportSnapshot());
  });

  it('says what is missing instead of printing NaN, null or undefined', () => {
    expect(report.snapshot.opinionOfValue).toBeNull();
    expect(report.snapshot.grid.regression).toBeNull();
    expect(report.flat).not.toMatch(/NaN|undefined|null|Infinity/);
    expect(report.flat).toContain('Not reached');
    expect(report.flat).toContain('At least 3 points are needed');
    for (const caution of CAUTIONS) expect(report.flat).toContain(normalise(caution));
    report.pages.forEach((page, i) => expect(page).toContain(`Page ${i + 1} of ${report.pages.length}`));
  });
});

describe('report PDF helpers', () => {
  it('the prediction band reproduces the analysis’s interval at the subject', () => {
    const snapshot = buildReportSnapshot();
    const group = snapshot.analysis.groups.find((g) => g.neighbourhood === 'Quarry Hill' && !g.pooled)!;
    const half = predictionHalfWidth(group.fit!, group.prediction!.x0)!;
    expect(group.prediction!.estimate - half).toBeCloseTo(group.prediction!.lower, 4);
    expect(group.prediction!.estimate + half).toBeCloseTo(group.prediction!.upper, 4);
  });

  it('has no band when the line fits exactly', () => {
    const fit = buildReportSnapshot().analysis.groups[0].fit!;
    expect(predictionHalfWidth({ ...fit, residualStdError: 0, slopeStdError: 0 }, fit.xMean)).toBeNull();
  });

  it('writes signs the embedded fonts lack in a form they can draw', () => {
    expect(printable('|r| ≥ 0.5 → ok')).toBe('|r| >= 0.5 -> ok');
    expect(printable('Łódź Ørsted — 1,820 ft²')).toBe('Lódz Ørsted — 1,820 ft²');
  });

  it('formats money per unit area and signed adjustments', () => {
    expect(perArea(161.6, { currency: 'USD', areaUnit: 'sqft' })).toBe('$162/ft²');
    expect(perArea(1739.5, { currency: 'EUR', areaUnit: 'sqm' })).toBe('€1,740/m²');
    expect(signedMoney(-6000, 'USD')).toBe('−$6,000');
    expect(signedMoney(2833.4, 'USD')).toBe('+$2,833');
    expect(signedMoney(Number.NaN, 'USD')).toBe('—');
  });
});

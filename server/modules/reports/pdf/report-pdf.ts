// The signed report as a PDF: the same content as the report page, on US Letter, with Compline's
// own fonts embedded and every chart drawn as vectors. Pages are buffered so that each footer can
// say "Page n of N" and carry the fingerprint.
import PDFDocument from 'pdfkit';
import type { ReportSnapshot } from '../../../contracts/report';
import { printable, registerFonts, FONT } from './fonts';
import { newPage, type ReportContext } from './layout';
import { writePageFurniture } from './page-furniture';
import { chartsSection } from './sections-charts';
import { flaggedSection } from './sections-flagged';
import { gridSection } from './sections-grid';
import { openingSection } from './sections-opening';
import { salesSection, subjectSection } from './sections-sales';
import { assumptionsSection, cautionsBlock, certificationSection } from './sections-statements';
import { PAGE } from './theme';

export interface RenderOptions {
  /** Where anyone can check the fingerprint, e.g. https://app.example/verify/<sha256>. */
  verifyUrl: string;
}

function createDocument(snapshot: ReportSnapshot, sha256: string): PDFKit.PDFDocument {
  const signedAt = new Date(snapshot.signedAt);
  const doc = new PDFDocument({
    size: 'LETTER',
    margins: { top: PAGE.top, bottom: PAGE.bottom, left: PAGE.left, right: PAGE.right },
    bufferPages: true,
    autoFirstPage: false,
    lang: 'en-US',
    displayTitle: true,
    info: {
      Title: printable(`Appraisal report — ${snapshot.assignment.subjectAddress}`),
      Subject: `SHA-256 ${sha256}`,
      Author: printable(snapshot.signer.name),
      Creator: 'Compline',
      Producer: 'Compline',
      Keywords: 'appraisal report, sales comparison',
      // The signing time, not the rendering time: the same version always renders the same file.
      CreationDate: Number.isNaN(signedAt.getTime()) ? undefined : signedAt,
      ModDate: Number.isNaN(signedAt.getTime()) ? undefined : signedAt,
    },
  });
  registerFonts(doc);
  doc.font(FONT.text);
  return doc;
}

function collect(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}

export async function renderReportPdf(snapshot: ReportSnapshot, sha256: string, options: RenderOptions): Promise<Buffer> {
  const doc = createDocument(snapshot, sha256);
  const done = collect(doc);
  const ctx: ReportContext = {
    doc,
    snapshot,
    units: { currency: snapshot.assignment.currency, areaUnit: snapshot.assignment.areaUnit },
    sha256,
    verifyUrl: options.verifyUrl,
  };
  newPage(doc);
  openingSection(ctx);
  subjectSection(ctx);
  salesSection(ctx);
  gridSection(ctx);
  flaggedSection(ctx);
  chartsSection(ctx);
  assumptionsSection(ctx);
  cautionsBlock(ctx);
  certificationSection(ctx);
  writePageFurniture(ctx);
  doc.end();
  return done;
}

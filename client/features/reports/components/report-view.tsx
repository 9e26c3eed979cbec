import { Link } from 'react-router-dom';
import type { z } from 'zod';
import type { reportResponse } from '@contracts/report';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Cautions } from '../../../components/ui/cautions';
import { Notice } from '../../../components/ui/notice';
import { reportPdfUrl, verifyPath } from '../api/report-queries';
import { formatMoment, reportFormat } from '../lib/report-format';
import { EvidenceSection } from './evidence-section';
import { FingerprintPanel } from './fingerprint-panel';
import { FlaggedSection } from './flagged-section';
import { ReportMap } from './report-map';
import { ReportSection } from './report-section';
import { SalesSection } from './sales-section';
import { CertificationSection, ConditionsSection, ReconciliationNote } from './statements-section';
import { ValueSummary } from './value-summary';
import '../report-print.css';

type Report = z.output<typeof reportResponse>;

/** A signed report version as a web page: Compline's own layout, the same content as the PDF. */
export function ReportView({ report }: { report: Report }) {
  const { snapshot, sha256, id } = report;
  const { assignment } = snapshot;
  const format = reportFormat(assignment.currency, assignment.areaUnit);
  const latest = report.laterVersions.at(-1);
  return (
    <article className="report-page flex flex-col gap-10" aria-labelledby="report-title">
      {latest !== undefined && (
        <Notice tone="warning" title="A later version of this report exists">
          This is version {snapshot.versionNumber}, kept as it was signed. {report.laterVersions.length === 1 ? 'One later version has' : `${report.laterVersions.length} later versions have`} been signed since.{' '}
          <Link to={`/reports/${latest}`} className="font-semibold text-ink underline underline-offset-4">
            Read the latest version
          </Link>
        </Notice>
      )}

      <header className="flex flex-wrap items-end justify-between gap-x-8 gap-y-4 border-b border-rule pb-5">
        <div className="min-w-0 max-w-3xl">
          <p className="figures text-[0.8125rem] font-medium tracking-wide text-ink-faint uppercase">
            Appraisal report · version {snapshot.versionNumber} · signed {formatMoment(snapshot.signedAt)}
          </p>
          <h1 id="report-title" className="mt-1 text-[2rem] leading-tight font-semibold text-ink">
            {assignment.subjectAddress}
          </h1>
          <p className="mt-2 text-[0.9375rem] text-ink-soft">
            For <span className="font-medium text-ink">{snapshot.clientName}</span>
            {assignment.loanReference ? (
              <>
                , loan <span className="figures">{assignment.loanReference}</span>
              </>
            ) : null}
            . Intended use: {assignment.intendedUse}. Prepared by {snapshot.firmName}; appraiser {snapshot.signer.name}.
          </p>
        </div>
        <div className="no-print flex flex-wrap items-center gap-2">
          <a href={reportPdfUrl(id)} download className={buttonClasses('primary', 'md')}>
            Download PDF
          </a>
          <Button onClick={() => window.print()}>Print</Button>
          <Link to={verifyPath(sha256)} className={buttonClasses('quiet', 'md', 'ml-2')}>
            Verify
          </Link>
        </div>
      </header>

      <ValueSummary snapshot={snapshot} format={format} />

      <ReportSection id="map" title="Where the sales are" lead={`The subject and every sale analysed, over the neighbourhood boundaries. The shaded area is ${snapshot.analysis.subjectGroup ?? 'the subject’s neighbourhood'}.`}>
        <ReportMap snapshot={snapshot} />
      </ReportSection>

      <ReportSection id="sales" title="The subject beside the sales compared" lead="Each sale carried into the adjustment grid, from its price to its adjusted price.">
        <SalesSection reportId={id} snapshot={snapshot} format={format} />
      </ReportSection>

      <ReportSection id="flagged" title="Sales the fit singled out" lead="A flagged sale is a question, not a verdict. Each one is listed with what the review did about it.">
        <FlaggedSection snapshot={snapshot} format={format} />
      </ReportSection>

      <ReportSection id="evidence" title="The market evidence" lead={`Price against floor area in ${snapshot.analysis.subjectGroup ?? 'the subject’s neighbourhood'}, and how prices moved over time.`}>
        <EvidenceSection snapshot={snapshot} format={format} />
      </ReportSection>

      <ReportSection id="reconciliation" title="How the value was reconciled">
        <ReconciliationNote snapshot={snapshot} />
      </ReportSection>

      <ReportSection id="conditions" title="Assumptions and conditions">
        <ConditionsSection snapshot={snapshot} />
      </ReportSection>

      <ReportSection id="certification" title="Certification">
        <CertificationSection snapshot={snapshot} />
      </ReportSection>

      <Cautions />

      <FingerprintPanel reportId={id} sha256={sha256} versionNumber={snapshot.versionNumber} />
    </article>
  );
}

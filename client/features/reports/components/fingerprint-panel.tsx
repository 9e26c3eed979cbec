import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/ui/button';
import { reportPdfUrl, verifyPath } from '../api/report-queries';
import { groupedFingerprint } from '../lib/report-format';

/** The version's SHA-256 fingerprint, where anyone can check it, and the PDF. */
export function FingerprintPanel({ reportId, sha256, versionNumber }: { reportId: number; sha256: string; versionNumber: number }) {
  const [copied, setCopied] = useState(false);
  const absoluteVerify = `${window.location.origin}${verifyPath(sha256)}`;
  return (
    <section aria-labelledby="fingerprint-title" className="report-card flex flex-col gap-3 rounded-lg border border-dashed border-ink-soft bg-paper-raised px-5 py-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="fingerprint-title" className="text-sm font-semibold tracking-wide text-ink uppercase">
          Fingerprint of version {versionNumber}
        </h2>
        <span className="text-[0.8125rem] text-ink-faint">SHA-256 of the frozen report</span>
      </div>
      <p className="figures text-[0.9375rem] leading-relaxed tracking-wide break-all text-ink" data-testid="fingerprint" data-sha256={sha256}>
        {groupedFingerprint(sha256)}
      </p>
      <p className="text-[0.875rem] text-ink-soft">
        Anyone holding a copy can check it at{' '}
        <Link to={verifyPath(sha256)} className="font-medium break-all text-ink underline underline-offset-4">
          {absoluteVerify}
        </Link>
        , without signing in.
      </p>
      <div className="no-print flex flex-wrap gap-2">
        <a href={reportPdfUrl(reportId)} download className={buttonClasses('secondary', 'sm')}>
          Download PDF
        </a>
        <Button
          size="sm"
          onClick={() =>
            void navigator.clipboard?.writeText(sha256).then(
              () => setCopied(true),
              () => setCopied(false),
            )
          }
        >
          {copied ? 'Copied' : 'Copy fingerprint'}
        </Button>
      </div>
    </section>
  );
}

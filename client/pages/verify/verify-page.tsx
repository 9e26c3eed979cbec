import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { Wordmark } from '../../components/ui/brand-mark';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { LoadingPanel } from '../../components/ui/query-states';
import { VerifyResult } from '../../features/reports/components/verify-result';
import { reportQueries } from '../../features/reports/api/report-queries';

const FINGERPRINT = /^[0-9a-f]{64}$/;

/** /verify/:sha256 — open to anyone, no sign-in: whether a report with this fingerprint was signed
 * in Compline, and what it says; plus a field to check another fingerprint. */
export function VerifyPage() {
  const params = useParams();
  const navigate = useNavigate();
  const given = (params.sha256 ?? '').trim().toLowerCase();
  const valid = FINGERPRINT.test(given);
  const result = useQuery({ ...reportQueries.verify(given), enabled: valid });
  const [typed, setTyped] = useState('');
  const [typedError, setTypedError] = useState<string | null>(null);

  return (
    <div className="min-h-dvh">
      <title>Check a report fingerprint · Compline</title>
      <header className="border-b border-rule bg-paper-raised/80">
        <div className="mx-auto flex max-w-4xl items-center justify-between px-6 py-4">
          <Link to="/" aria-label="Compline" className="rounded-sm">
            <Wordmark />
          </Link>
          <span className="text-[0.8125rem] text-ink-faint">Public check · no sign-in needed</span>
        </div>
      </header>
      <main className="mx-auto flex max-w-4xl flex-col gap-8 px-6 py-10">
        <div>
          <p className="text-[0.8125rem] font-medium tracking-wide text-ink-faint uppercase">Report fingerprint check</p>
          <h1 className="mt-1 text-[1.75rem] leading-tight font-semibold text-ink">Was this report signed?</h1>
          <p className="mt-2 max-w-2xl text-[0.9375rem] text-ink-soft">
            Every signed Compline report carries a SHA-256 fingerprint of its frozen content, printed on each page of the PDF. If a copy’s fingerprint is found here, the copy is the report as signed; if a single figure had been changed, the fingerprint would differ.
          </p>
        </div>

        {params.sha256 !== undefined && !valid && (
          <VerifyResult state="malformed" fingerprint={params.sha256} />
        )}
        {valid && result.isPending && <LoadingPanel label="Looking the fingerprint up…" />}
        {valid && result.isError && <VerifyResult state="error" fingerprint={given} error={result.error} onRetry={() => void result.refetch()} />}
        {valid && result.isSuccess && <VerifyResult state={result.data.found ? 'found' : 'unknown'} fingerprint={given} report={result.data.report} />}

        <form
          className="flex flex-col gap-3 rounded-lg border border-rule bg-paper-raised px-5 py-5"
          onSubmit={(event) => {
            event.preventDefault();
            const clean = typed.replace(/\s+/g, '').toLowerCase();
            if (!FINGERPRINT.test(clean)) return setTypedError('A fingerprint is 64 characters, 0–9 and a–f (spaces are ignored).');
            setTypedError(null);
            navigate(`/verify/${clean}`);
          }}
        >
          <TextField label="Check another fingerprint" placeholder="Paste the 64 characters from the report" className="figures" value={typed} onChange={(event) => setTyped(event.target.value)} error={typedError ?? undefined} />
          <Button type="submit" variant="primary" className="self-start">
            Check
          </Button>
        </form>
        <p className="text-[0.8125rem] text-ink-faint">A match shows that a report was signed as stated; the value opinion in it remains the signing appraiser’s, under the standards that govern where the property lies.</p>
      </main>
    </div>
  );
}

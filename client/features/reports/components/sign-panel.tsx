import { useMutation } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { signRequest } from '@contracts/report';
import { CERTIFICATION_STATEMENTS } from '@contracts/report-text';
import { Button } from '../../../components/ui/button';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { describeError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { reportRequests } from '../api/report-queries';

/** The checkbox holds a boolean; the contract takes only `true`, so the form checks it is ticked. */
const signForm = signRequest.omit({ version: true, certify: true }).extend({ certify: z.boolean().refine((ticked) => ticked, 'Confirm the certification to sign.') });
type SignFormValues = z.input<typeof signForm>;
type SignFormOutput = z.output<typeof signForm>;
export interface SignedVersion {
  reportVersionId: number;
  versionNumber: number;
  sha256: string;
}

/** Signing an approved assignment: the appraiser confirms the certification, states the licence
 * and the jurisdiction that issued it, and any extraordinary assumption or hypothetical condition.
 * The server freezes everything into a new version with its fingerprint. */
export function SignPanel({ assignmentId, version, onSigned }: { assignmentId: number; version: number; onSigned: (signed: SignedVersion) => void | Promise<void> }) {
  const form = useForm<SignFormValues, unknown, SignFormOutput>({
    resolver: zodResolver(signForm),
    defaultValues: { certify: false, licenceNumber: '', jurisdiction: '', extraordinaryAssumptions: '', hypotheticalConditions: '' },
  });
  const { errors } = form.formState;
  const sign = useMutation({ mutationFn: (values: SignFormOutput) => reportRequests.sign(assignmentId, { ...values, certify: true, version }), onSuccess: onSigned });
  const onSubmit = form.handleSubmit((values) =>
    sign.mutate(values, { onError: (error) => applyServerFieldErrors(error, form.setError, ['certify', 'licenceNumber', 'jurisdiction', 'extraordinaryAssumptions', 'hypotheticalConditions']) }),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Sign the report" className="flex flex-col gap-5 rounded-xl border-2 border-ink bg-paper-raised px-5 py-5 lg:px-7">
      <div>
        <h3 className="text-[1.125rem] font-semibold text-ink">Sign and deliver</h3>
        <p className="mt-1 max-w-3xl text-[0.9375rem] text-ink-soft">
          Signing freezes every input and result of this assignment as a new report version with its SHA-256 fingerprint, and e-mails the client. Later changes make a new version; this one stays readable as signed.
        </p>
      </div>
      {sign.isError && <Notice tone="error" title="The report was not signed">{describeError(sign.error)}</Notice>}
      <div className="rounded-lg border border-rule bg-paper px-4 py-4">
        <p className="text-sm font-semibold text-ink">Certification</p>
        <ol className="mt-2 flex flex-col gap-2">
          {CERTIFICATION_STATEMENTS.map((text, i) => (
            <li key={i} className="flex gap-3 text-[0.9375rem] leading-relaxed text-ink">
              <span aria-hidden className="figures text-sm text-ink-faint">{i + 1}.</span>
              <span>{text}</span>
            </li>
          ))}
        </ol>
        <label className="mt-4 flex cursor-pointer items-start gap-3 border-t border-rule pt-3">
          <input type="checkbox" className="mt-1 size-4 accent-[var(--color-ink)]" aria-invalid={errors.certify ? true : undefined} {...form.register('certify')} />
          <span className="text-[0.9375rem] font-semibold text-ink">I certify each statement above for this report.</span>
        </label>
        {errors.certify && <p className="mt-1 text-[0.8125rem] font-medium text-rust">{errors.certify.message}</p>}
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        <TextField label="Licence or certificate number" autoComplete="off" className="figures" error={errors.licenceNumber?.message} {...form.register('licenceNumber')} />
        <TextField label="Issued by (jurisdiction)" autoComplete="off" error={errors.jurisdiction?.message} {...form.register('jurisdiction')} />
        <TextAreaField label="Extraordinary assumptions" hint="Leave empty when there are none." error={errors.extraordinaryAssumptions?.message} {...form.register('extraordinaryAssumptions')} />
        <TextAreaField label="Hypothetical conditions" hint="Leave empty when there are none." error={errors.hypotheticalConditions?.message} {...form.register('hypotheticalConditions')} />
      </div>
      <div className="flex flex-wrap items-center gap-4 border-t border-rule pt-4">
        <Button type="submit" variant="primary" busy={sign.isPending} busyLabel="Signing…">
          Sign the report
        </Button>
        <p className="text-[0.875rem] text-ink-soft">Your signature applies to this version only.</p>
      </div>
    </form>
  );
}

import { useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Reconsideration } from '@contracts/reconsiderations';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextAreaField } from '../../../components/ui/field';
import { describeError, isApiError } from '../../../lib/api-error';
import { reconsiderationQueries, reconsiderationRequests } from '../api/reconsideration-queries';

type Decision = 'keep-value' | 'revise';

/** The appraiser's answer: keep the value with reasons, or revise — the assignment reopens as a new
 * draft with the client's sales added, and signing it issues the next version. */
export function RespondForm({ request, onAnswered }: { request: Reconsideration; onAnswered: (decision: Decision) => void | Promise<void> }) {
  const queryClient = useQueryClient();
  const [decision, setDecision] = useState<Decision>('keep-value');
  const [response, setResponse] = useState('');
  const respond = useMutation({
    mutationFn: () => reconsiderationRequests.respond(request.id, { decision, response, version: request.version }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: reconsiderationQueries.all() });
      await onAnswered(decision);
    },
  });
  const fieldError = isApiError(respond.error) ? respond.error.fields?.response : undefined;
  return (
    <form
      aria-label={`Answer the request of ${request.requestedByName}`}
      className="flex flex-col gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        respond.mutate();
      }}
    >
      {respond.isError && !fieldError && <Notice tone="error">{describeError(respond.error)}</Notice>}
      <fieldset className="flex flex-wrap gap-2">
        <legend className="mb-1.5 text-sm font-semibold text-ink">Your decision</legend>
        {(
          [
            ['keep-value', 'Keep the value', 'Explain why the signed value stands.'],
            ['revise', 'Revise — open a new draft', 'The extra sales are added to the assignment for a new signed version.'],
          ] as const
        ).map(([value, label, hint]) => (
          <label key={value} className="flex min-w-60 flex-1 cursor-pointer items-start gap-2.5 rounded-md border border-rule-strong bg-paper-raised px-3 py-2 has-[:checked]:border-ink has-[:checked]:shadow-[inset_0_0_0_1px_var(--color-ink)]">
            <input type="radio" name={`decision-${request.id}`} value={value} checked={decision === value} onChange={() => setDecision(value)} className="mt-1 accent-[var(--color-ink)]" />
            <span>
              <span className="block text-[0.9375rem] font-semibold text-ink">{label}</span>
              <span className="block text-[0.8125rem] text-ink-soft">{hint}</span>
            </span>
          </label>
        ))}
      </fieldset>
      <TextAreaField label="Reasons, as the client will read them" rows={3} value={response} onChange={(event) => setResponse(event.target.value)} error={fieldError} />
      <Button type="submit" variant="primary" size="sm" className="self-start" disabled={response.trim().length < 10} busy={respond.isPending} busyLabel="Sending the answer…">
        {decision === 'revise' ? 'Answer and open a new draft' : 'Answer: the value stands'}
      </Button>
    </form>
  );
}

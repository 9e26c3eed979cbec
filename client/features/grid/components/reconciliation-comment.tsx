import { useState } from 'react';
import type { GridResponse } from '@contracts/grid';
import { Button } from '../../../components/ui/button';
import type { useGridSave } from '../hooks/use-grid-save';
import { SaveProblemNotice } from './save-problem';
import { TextAreaField } from '../../../components/ui/field';

interface ReconciliationCommentProps {
  grid: GridResponse;
  editable: boolean;
  saver: ReturnType<typeof useGridSave>;
}

/** The appraiser's reasoning from the adjusted prices to the opinion of value; required before the
 * assignment can go to review. */
export function ReconciliationComment({ grid, editable, saver }: ReconciliationCommentProps) {
  const [draft, setDraft] = useState<string | null>(null);
  const saved = grid.settings.reconciliationComment ?? '';
  const text = draft ?? saved;

  async function save() {
    const ok = await saver.save([{ kind: 'settings', change: { version: grid.settings.version, reconciliationComment: text.trim() || null } }]);
    if (ok) setDraft(null);
  }

  if (!editable) {
    return (
      <p className={`text-[0.9375rem] leading-relaxed whitespace-pre-wrap ${saved ? 'text-ink' : 'text-ink-faint'}`}>{saved || 'Not written yet.'}</p>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <TextAreaField
        label="Reconciliation comment (required before submission)"
        hint="Which sales carry the most weight and why; how the checks above were weighed."
        value={text}
        maxLength={8000}
        rows={4}
        onChange={(e) => setDraft(e.target.value)}
      />
      <SaveProblemNotice problem={saver.problem} onDismiss={saver.clearProblem} />
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={() => void save()} disabled={draft === null || draft === saved} busy={saver.saving} busyLabel="Saving the comment…">
          Save the comment
        </Button>
        {draft !== null && draft !== saved && <span className="text-[0.8125rem] text-ink-faint">Not saved yet.</span>}
      </div>
    </div>
  );
}

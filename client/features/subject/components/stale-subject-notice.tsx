import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import type { EditConflictRow } from '../../../lib/edit-conflict';
import type { SubjectField } from '../lib/subject-form';

const shown = (value: string) => (value.trim() === '' ? '(blank)' : value);

/** After a 409: the person's edits beside what is saved now, and the two ways on. Nothing typed is lost. */
export function StaleSubjectNotice({ rows, otherFields, labels, onKeepMine, onTakeTheirs }: {
  rows: EditConflictRow<SubjectField>[];
  otherFields: SubjectField[];
  labels: Record<SubjectField, string>;
  onKeepMine: () => void;
  onTakeTheirs: () => void;
}) {
  return (
    <Notice
      tone="warning"
      title="Someone else saved the subject while you were editing"
      actions={
        <>
          <Button size="sm" onClick={onKeepMine}>
            Load their version, keep my edits
          </Button>
          <Button size="sm" variant="quiet" onClick={onTakeTheirs}>
            Discard my edits
          </Button>
        </>
      }
    >
      <p>Your changes were not saved yet. What you typed, next to what is saved now:</p>
      {rows.length > 0 && (
        <table className="mt-2 w-full max-w-2xl text-left text-sm">
          <thead>
            <tr className="text-xs text-ink-faint">
              <th className="py-1 pr-3 font-semibold">Field</th>
              <th className="py-1 pr-3 font-semibold">You typed</th>
              <th className="py-1 font-semibold">Saved now</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.field} className="border-t border-ochre/30">
                <td className="py-1 pr-3 text-ink">{labels[row.field]}</td>
                <td className="figures py-1 pr-3 text-ink">{shown(row.yours)}</td>
                <td className={`figures py-1 ${row.changedSince ? 'font-semibold text-rust' : 'text-ink-soft'}`}>
                  {shown(row.now)}
                  {row.changedSince && <span className="ml-1 font-sans text-xs font-normal">(changed by them)</span>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {otherFields.length > 0 && <p className="mt-2 text-sm">They also changed: {otherFields.map((f) => labels[f]).join(', ')}.</p>}
    </Notice>
  );
}

import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import type { EditConflictRow } from '../../lib/edit-conflict';

const shown = (value: string) => (value.trim() === '' ? '(blank)' : value);

/** After a 409 on a form: what the person typed beside what is saved now, the fields the other save
 * also changed, and the two ways on. Nothing typed is lost. */
export function StaleEditNotice<F extends string>({ title, rows, otherFields, labels, onKeepMine, onTakeTheirs }: {
  title: string;
  rows: EditConflictRow<F>[];
  otherFields: F[];
  labels: Record<F, string>;
  onKeepMine: () => void;
  onTakeTheirs: () => void;
}) {
  return (
    <Notice
      tone="warning"
      title={title}
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
      <p>Your edit was not saved. What you typed, next to what is saved now:</p>
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

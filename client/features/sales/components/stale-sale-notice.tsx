import type { EditConflictRow } from '../../../lib/edit-conflict';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { saleFieldLabels, type SaleFormField } from '../lib/sale-form';

export type SaleConflict =
  | { kind: 'changed'; rows: EditConflictRow<SaleFormField>[]; otherFields: SaleFormField[] }
  | { kind: 'deleted' };

const shown = (value: string) => (value.trim() === '' ? '(blank)' : value);

/** What another save changed while this form was open, and the two ways on. Nothing typed is lost. */
export function StaleSaleNotice({ conflict, onKeepMine, onTakeTheirs, onClose }: { conflict: SaleConflict; onKeepMine: () => void; onTakeTheirs: () => void; onClose: () => void }) {
  if (conflict.kind === 'deleted') {
    return (
      <Notice tone="warning" title="This sale was deleted by someone else" actions={<Button size="sm" onClick={onClose}>Close the form</Button>}>
        Your edits were not saved. Copy anything you need from the form before closing it.
      </Notice>
    );
  }
  return (
    <Notice
      tone="warning"
      title="Someone else saved this sale while you were editing"
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
      <p>Your edit was not saved. Here is what you changed next to what is saved now:</p>
      {conflict.rows.length > 0 && (
        <table className="mt-2 w-full text-left text-sm">
          <thead>
            <tr className="text-xs text-ink-faint">
              <th className="py-1 pr-3 font-semibold">Field</th>
              <th className="py-1 pr-3 font-semibold">You typed</th>
              <th className="py-1 font-semibold">Saved now</th>
            </tr>
          </thead>
          <tbody>
            {conflict.rows.map((row) => (
              <tr key={row.field} className="border-t border-ochre/30">
                <td className="py-1 pr-3 text-ink">{saleFieldLabels[row.field]}</td>
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
      {conflict.otherFields.length > 0 && (
        <p className="mt-2 text-sm">They also changed: {conflict.otherFields.map((f) => saleFieldLabels[f]).join(', ')}.</p>
      )}
    </Notice>
  );
}

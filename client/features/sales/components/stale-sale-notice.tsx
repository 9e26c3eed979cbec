import type { EditConflictRow } from '../../../lib/edit-conflict';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { StaleEditNotice } from '../../../components/forms/stale-edit-notice';
import { saleFieldLabels, type SaleFormField } from '../lib/sale-form';

export type SaleConflict =
  | { kind: 'changed'; rows: EditConflictRow<SaleFormField>[]; otherFields: SaleFormField[] }
  | { kind: 'deleted' };

/** What another save did to this sale while the form was open, and the ways on. Nothing typed is lost. */
export function StaleSaleNotice({ conflict, onKeepMine, onTakeTheirs, onClose }: { conflict: SaleConflict; onKeepMine: () => void; onTakeTheirs: () => void; onClose: () => void }) {
  if (conflict.kind === 'deleted') {
    return (
      <Notice tone="warning" title="This sale was deleted by someone else" actions={<Button size="sm" onClick={onClose}>Close the form</Button>}>
        Your edits were not saved. Copy anything you need from the form before closing it.
      </Notice>
    );
  }
  return (
    <StaleEditNotice
      title="Someone else saved this sale while you were editing"
      rows={conflict.rows}
      otherFields={conflict.otherFields}
      labels={saleFieldLabels}
      onKeepMine={onKeepMine}
      onTakeTheirs={onTakeTheirs}
    />
  );
}

import { Button } from '../../../components/ui/button';

/** The second step of deleting a sale: say what happens, then do it only on a second click. */
export function DeleteSaleConfirm({ address, busy, onConfirm, onCancel }: { address: string; busy: boolean; onConfirm: () => void; onCancel: () => void }) {
  return (
    <div role="alertdialog" aria-labelledby="delete-sale-title" aria-describedby="delete-sale-text" className="rounded-md border border-rust/40 bg-rust-wash px-4 py-3">
      <p id="delete-sale-title" className="font-semibold text-ink">
        Delete {address}?
      </p>
      <p id="delete-sale-text" className="mt-0.5 text-[0.9375rem] text-ink-soft">
        It leaves the table, the map, the fit and the grid. The record itself is kept in the file and the audit trail.
      </p>
      <div className="mt-3 flex gap-2">
        <Button variant="danger" size="sm" busy={busy} busyLabel="Deleting…" onClick={onConfirm}>
          Delete this sale
        </Button>
        <Button size="sm" onClick={onCancel}>
          Keep it
        </Button>
      </div>
    </div>
  );
}

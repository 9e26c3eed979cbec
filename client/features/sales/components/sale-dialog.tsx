import { useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { Sale } from '@contracts/sales';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { describeError, isApiError } from '../../../lib/api-error';
import { compareEditsWithServer, fieldsChangedElsewhere } from '../../../lib/edit-conflict';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { saleQueries } from '../api/sale-queries';
import { useSaleMutations } from '../hooks/use-sale-mutations';
import { blankSaleForm, saleBody, saleFormFields, saleFormSchema, saleToForm, type SaleFormField, type SaleFormOutput, type SaleFormValues } from '../lib/sale-form';
import { SaleFormFields } from './sale-form-fields';
import { StaleSaleNotice, type SaleConflict } from './stale-sale-notice';
import { DeleteSaleConfirm } from './delete-sale-confirm';

export type SaleDialogMode = { kind: 'add'; at: { lon: number; lat: number } | null } | { kind: 'edit'; sale: Sale };

interface SaleDialogProps {
  assignmentId: number;
  mode: SaleDialogMode;
  currency: string;
  areaSymbol: string;
  onClose: () => void;
  onSaved: (sale: Sale) => void;
}

function startingValues(mode: SaleDialogMode): SaleFormValues {
  if (mode.kind === 'edit') return saleToForm(mode.sale);
  return mode.at ? { ...blankSaleForm, lon: String(mode.at.lon), lat: String(mode.at.lat) } : blankSaleForm;
}

/** Adds or edits one sale in a modal dialog; an edit sends the version it started from. */
export function SaleDialog({ assignmentId, mode, currency, areaSymbol, onClose, onSaved }: SaleDialogProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    if (!dialog.current?.open) dialog.current?.showModal();
  }, []);
  const saleId = mode.kind === 'edit' ? mode.sale.id : null;
  const [base, setBase] = useState(() => ({ values: startingValues(mode), version: mode.kind === 'edit' ? mode.sale.version : 0 }));
  const form = useForm<SaleFormValues, unknown, SaleFormOutput>({ resolver: zodResolver(saleFormSchema), defaultValues: base.values });
  const { create, update, remove } = useSaleMutations(assignmentId);
  const queryClient = useQueryClient();
  const [conflict, setConflict] = useState<{ conflict: SaleConflict; fresh: Sale | null; edited: SaleFormField[] } | null>(null);
  const [failure, setFailure] = useState<unknown>(null);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  // A conflict or a refusal is news: bring the top of the form, where it is shown, into view.
  const body = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (conflict || failure != null) body.current?.scrollTo({ top: 0, behavior: 'smooth' });
  }, [conflict, failure]);

  const showConflict = async () => {
    const edited = Object.keys(form.formState.dirtyFields) as SaleFormField[];
    const list = await queryClient.fetchQuery({ ...saleQueries.list(assignmentId), staleTime: 0 });
    const fresh = list.sales.find((s) => s.id === saleId) ?? null;
    if (!fresh) return setConflict({ conflict: { kind: 'deleted' }, fresh, edited });
    const now = saleToForm(fresh);
    const rows = compareEditsWithServer(edited, base.values, form.getValues(), now);
    setConflict({ conflict: { kind: 'changed', rows, otherFields: fieldsChangedElsewhere(saleFormFields, edited, base.values, now) }, fresh, edited });
  };

  const reload = (keepMine: boolean) => {
    if (!conflict?.fresh) return;
    const yours = form.getValues();
    const now = saleToForm(conflict.fresh);
    setBase({ values: now, version: conflict.fresh.version });
    form.reset(now);
    if (keepMine) for (const field of conflict.edited) form.setValue(field, yours[field], { shouldDirty: true });
    setConflict(null);
  };

  const onError = (error: unknown) => {
    if (isApiError(error) && error.code === 'stale_version') return void showConflict();
    if (!applyServerFieldErrors(error, form.setError, saleFormFields)) setFailure(error);
  };

  const onSubmit = form.handleSubmit((values) => {
    setFailure(null);
    const body = saleBody(values);
    if (saleId === null) create.mutate(body, { onSuccess: onSaved, onError });
    else update.mutate({ saleId, body: { ...body, version: base.version } }, { onSuccess: onSaved, onError });
  });

  const onDelete = () => {
    if (saleId === null) return;
    setFailure(null);
    remove.mutate({ saleId, version: base.version }, { onSuccess: onClose, onError: (error) => (setConfirmingDelete(false), onError(error)) });
  };

  const title = mode.kind === 'edit' ? `Edit ${mode.sale.address}` : 'Add a sale';
  const saving = create.isPending || update.isPending;
  return (
    <dialog
      ref={dialog}
      aria-labelledby="sale-dialog-title"
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      className="m-auto max-h-[calc(100dvh-2rem)] w-[min(58rem,calc(100vw-2rem))] overflow-hidden rounded-xl border border-rule-strong bg-paper p-0 text-ink shadow-[0_24px_60px_rgb(29_42_68/0.28)] backdrop:bg-ink/35"
    >
      <form onSubmit={onSubmit} noValidate className="flex max-h-[calc(100dvh-2rem)] flex-col">
        <header className="flex items-start justify-between gap-4 border-b border-rule bg-paper-raised px-6 py-4">
          <div>
            <h2 id="sale-dialog-title" className="text-lg font-semibold">
              {title}
            </h2>
            <p className="mt-0.5 text-sm text-ink-soft">
              {mode.kind === 'add' && mode.at ? 'Placed where you clicked on the map; adjust the figures below.' : 'Every figure as recorded at the sale.'}
            </p>
          </div>
          <Button size="sm" variant="quiet" onClick={onClose} aria-label="Close without saving">
            Close
          </Button>
        </header>
        <div ref={body} className="flex min-h-0 flex-col gap-4 overflow-y-auto px-6 py-5 [&>*]:shrink-0">
          {conflict && <StaleSaleNotice conflict={conflict.conflict} onKeepMine={() => reload(true)} onTakeTheirs={() => reload(false)} onClose={onClose} />}
          {failure != null && <Notice tone="error">{describeError(failure)}</Notice>}
          <SaleFormFields form={form} currency={currency} areaSymbol={areaSymbol} />
          {confirmingDelete && mode.kind === 'edit' && (
            <DeleteSaleConfirm address={mode.sale.address} busy={remove.isPending} onConfirm={onDelete} onCancel={() => setConfirmingDelete(false)} />
          )}
        </div>
        <footer className="flex flex-wrap items-center gap-3 border-t border-rule bg-paper-raised px-6 py-3.5">
          <Button type="submit" variant="primary" busy={saving} busyLabel="Saving…" disabled={conflict !== null}>
            {mode.kind === 'edit' ? 'Save changes' : 'Add sale'}
          </Button>
          <Button onClick={onClose}>Cancel</Button>
          {mode.kind === 'edit' && !confirmingDelete && (
            <Button variant="danger" className="ml-auto" onClick={() => setConfirmingDelete(true)}>
              Delete sale…
            </Button>
          )}
        </footer>
      </form>
    </dialog>
  );
}

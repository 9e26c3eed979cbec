import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { saleTypeLabels, saleTypes } from '@contracts/sales';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import type { ReconsiderationFormValues } from '../lib/reconsideration-form';

type SaleErrors = FieldErrors<ReconsiderationFormValues>['sales'];

/** The fields of one extra sale: the essentials in view, the rest under "More about this sale". */
export function ExtraSaleFields({ index, register, errors, onRemove, unit }: { index: number; register: UseFormRegister<ReconsiderationFormValues>; errors: SaleErrors; onRemove: () => void; unit: string }) {
  const e = Array.isArray(errors) ? errors[index] : undefined;
  const name = <K extends keyof ReconsiderationFormValues['sales'][number]>(field: K) => `sales.${index}.${field}` as const;
  const n = index + 1;
  return (
    <fieldset className="flex flex-col gap-4 rounded-lg border border-rule-strong bg-paper-raised px-4 py-4">
      <legend className="sr-only">Extra sale {n}</legend>
      <div className="flex items-center justify-between gap-3">
        <p aria-hidden className="text-[0.9375rem] font-semibold text-ink">Extra sale {n}</p>
        <Button size="sm" variant="quiet" onClick={onRemove}>
          Remove sale {n}
        </Button>
      </div>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <div className="sm:col-span-2">
          <TextField label="Address" autoComplete="off" error={e?.address?.message} {...register(name('address'))} />
        </div>
        <TextField label={`Sale date`} type="date" className="figures" error={e?.saleDate?.message} {...register(name('saleDate'))} />
        <TextField label={`Sale price`} inputMode="decimal" className="figures" error={e?.salePrice?.message} {...register(name('salePrice'))} />
        <TextField label={`Floor area (${unit})`} inputMode="decimal" className="figures" error={e?.floorArea?.message} {...register(name('floorArea'))} />
        <SelectField label={`Sale type`} error={e?.saleType?.message} {...register(name('saleType'))}>
          {saleTypes.map((t) => (
            <option key={t} value={t}>
              {saleTypeLabels[t]}
            </option>
          ))}
        </SelectField>
        <TextField label={`Seller concessions`} inputMode="decimal" className="figures" error={e?.sellerConcessions?.message} {...register(name('sellerConcessions'))} />
        <TextField label={`Data source`} placeholder="Registry of deeds, agent, listing service…" error={e?.dataSource?.message} {...register(name('dataSource'))} />
      </div>
      <details className="group">
        <summary className="cursor-pointer text-[0.875rem] font-semibold text-ink-soft hover:text-ink">More about this sale (optional)</summary>
        <div className="mt-3 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <TextField label={`Neighbourhood`} hint="Left blank, the map’s boundaries decide." error={e?.neighbourhood?.message} {...register(name('neighbourhood'))} />
          <TextField label={`Lot size`} inputMode="decimal" className="figures" error={e?.lotSize?.message} {...register(name('lotSize'))} />
          <TextField label={`Bedrooms`} inputMode="numeric" className="figures" error={e?.bedrooms?.message} {...register(name('bedrooms'))} />
          <TextField label={`Bathrooms`} inputMode="decimal" className="figures" error={e?.bathrooms?.message} {...register(name('bathrooms'))} />
          <TextField label={`Year built`} inputMode="numeric" className="figures" error={e?.yearBuilt?.message} {...register(name('yearBuilt'))} />
          <TextField label={`Condition (1–6)`} inputMode="numeric" className="figures" error={e?.condition?.message} {...register(name('condition'))} />
          <TextField label={`Quality (1–6)`} inputMode="numeric" className="figures" error={e?.quality?.message} {...register(name('quality'))} />
          <TextField label={`Garage spaces`} inputMode="numeric" className="figures" error={e?.garageSpaces?.message} {...register(name('garageSpaces'))} />
          <TextField label={`Longitude`} inputMode="decimal" className="figures" error={e?.lon?.message} {...register(name('lon'))} />
          <TextField label={`Latitude`} inputMode="decimal" className="figures" error={e?.lat?.message} {...register(name('lat'))} />
          <div className="sm:col-span-2">
            <TextField label={`Verification note`} error={e?.verificationNote?.message} {...register(name('verificationNote'))} />
          </div>
        </div>
      </details>
    </fieldset>
  );
}

import { useId, type ReactNode } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import { saleTypeLabels, saleTypes } from '@contracts/sales';
import { SelectField, TextField } from '../../../components/ui/field';
import { conditionWords, qualityWords, ratingSteps } from '../../../lib/rating-scales';
import type { SaleFormOutput, SaleFormValues } from '../lib/sale-form';

type SaleForm = UseFormReturn<SaleFormValues, unknown, SaleFormOutput>;

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="grid grid-cols-1 gap-x-4 gap-y-3.5 border-t border-rule pt-4 first:border-t-0 first:pt-0 sm:grid-cols-2 lg:grid-cols-4">
      <legend className="float-left mb-1 w-full text-xs font-semibold tracking-wide text-ink-faint uppercase sm:col-span-2 lg:col-span-4">{title}</legend>
      {children}
    </fieldset>
  );
}

/** The fields of a sale, grouped as an appraiser reads a sale: where, the sale, the house, the source. */
export function SaleFormFields({ form, currency, areaSymbol }: { form: SaleForm; currency: string; areaSymbol: string }) {
  const { register, formState } = form;
  const e = formState.errors;
  const noteId = useId();
  const numeric = { inputMode: 'decimal' as const, autoComplete: 'off', className: 'figures' };
  return (
    <div className="flex flex-col gap-5">
      <Section title="Where">
        <div className="sm:col-span-2">
          <TextField label="Address" autoComplete="off" error={e.address?.message} {...register('address')} />
        </div>
        <TextField label="Longitude" {...numeric} error={e.lon?.message} {...register('lon')} />
        <TextField label="Latitude" {...numeric} error={e.lat?.message} {...register('lat')} />
        <div className="sm:col-span-2">
          <TextField
            label="Neighbourhood"
            autoComplete="off"
            hint="Leave blank to take it from the map’s neighbourhood boundaries."
            error={e.neighbourhood?.message}
            {...register('neighbourhood')}
          />
        </div>
      </Section>
      <Section title="The sale">
        <TextField label={`Sale price (${currency})`} {...numeric} error={e.salePrice?.message} {...register('salePrice')} />
        <TextField label="Sale date" type="date" className="figures" error={e.saleDate?.message} {...register('saleDate')} />
        <SelectField label="Sale type" error={e.saleType?.message} {...register('saleType')}>
          {saleTypes.map((type) => (
            <option key={type} value={type}>
              {saleTypeLabels[type]}
            </option>
          ))}
        </SelectField>
        <TextField label={`Seller concessions (${currency})`} {...numeric} error={e.sellerConcessions?.message} {...register('sellerConcessions')} />
      </Section>
      <Section title="The house">
        <TextField label={`Gross living area (${areaSymbol})`} {...numeric} error={e.floorArea?.message} {...register('floorArea')} />
        <TextField label={`Lot size (${areaSymbol})`} {...numeric} error={e.lotSize?.message} {...register('lotSize')} />
        <TextField label="Year built" {...numeric} inputMode="numeric" error={e.yearBuilt?.message} {...register('yearBuilt')} />
        <TextField label="Garage spaces" {...numeric} inputMode="numeric" error={e.garageSpaces?.message} {...register('garageSpaces')} />
        <TextField label="Bedrooms" {...numeric} inputMode="numeric" error={e.bedrooms?.message} {...register('bedrooms')} />
        <TextField label="Bathrooms" {...numeric} hint="In halves: 1.5, 2" error={e.bathrooms?.message} {...register('bathrooms')} />
        <SelectField label="Condition" error={e.condition?.message} {...register('condition')}>
          <option value="">Not rated</option>
          {ratingSteps.map((step) => (
            <option key={step} value={String(step)}>
              {step} · {conditionWords[step]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Quality" error={e.quality?.message} {...register('quality')}>
          <option value="">Not rated</option>
          {ratingSteps.map((step) => (
            <option key={step} value={String(step)}>
              {step} · {qualityWords[step]}
            </option>
          ))}
        </SelectField>
      </Section>
      <Section title="Source and verification">
        <div className="sm:col-span-2">
          <TextField label="Data source" autoComplete="off" error={e.dataSource?.message} {...register('dataSource')} />
        </div>
        <div className="flex flex-col gap-1.5 sm:col-span-2">
          <label htmlFor={noteId} className="text-sm font-semibold text-ink">
            Verification note
          </label>
          <textarea
            id={noteId}
            rows={2}
            aria-invalid={e.verificationNote ? true : undefined}
            className={`block w-full rounded-md border bg-paper-raised px-3 py-2 text-[0.9375rem] text-ink focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none ${e.verificationNote ? 'border-rust' : 'border-rule-strong'}`}
            {...register('verificationNote')}
          />
          {e.verificationNote && <p className="text-[0.8125rem] font-medium text-rust">{e.verificationNote.message}</p>}
        </div>
      </Section>
    </div>
  );
}

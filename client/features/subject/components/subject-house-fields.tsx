import { useId } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import { SelectField, TextField } from '../../../components/ui/field';
import { conditionWords, qualityWords, ratingSteps } from '../../../lib/rating-scales';
import type { SubjectField, SubjectFormOutput, SubjectFormValues } from '../lib/subject-form';

type SubjectForm = UseFormReturn<SubjectFormValues, unknown, SubjectFormOutput>;

/** The subject's characteristics: area, lot, rooms, age, the two six-step ratings, notes. */
export function SubjectHouseFields({ form, labels }: { form: SubjectForm; labels: Record<SubjectField, string> }) {
  const { register, formState } = form;
  const e = formState.errors;
  const notesId = useId();
  const numeric = { inputMode: 'decimal' as const, autoComplete: 'off', className: 'figures' };
  return (
    <div className="flex flex-col gap-4">
      <div className="grid grid-cols-1 gap-x-4 gap-y-3.5 sm:grid-cols-2">
        <TextField label={labels.floorArea} {...numeric} hint="Above-grade finished area" error={e.floorArea?.message} {...register('floorArea')} />
        <TextField label={labels.lotSize} {...numeric} error={e.lotSize?.message} {...register('lotSize')} />
        <TextField label={labels.bedrooms} {...numeric} inputMode="numeric" error={e.bedrooms?.message} {...register('bedrooms')} />
        <TextField label={labels.bathrooms} {...numeric} hint="In halves: 1.5, 2" error={e.bathrooms?.message} {...register('bathrooms')} />
        <TextField label={labels.yearBuilt} {...numeric} inputMode="numeric" error={e.yearBuilt?.message} {...register('yearBuilt')} />
        <TextField label={labels.garageSpaces} {...numeric} inputMode="numeric" error={e.garageSpaces?.message} {...register('garageSpaces')} />
        <SelectField label={labels.condition} hint="1 is best" error={e.condition?.message} {...register('condition')}>
          <option value="">Not rated yet</option>
          {ratingSteps.map((step) => (
            <option key={step} value={String(step)}>
              {step} · {conditionWords[step]}
            </option>
          ))}
        </SelectField>
        <SelectField label={labels.quality} hint="1 is best" error={e.quality?.message} {...register('quality')}>
          <option value="">Not rated yet</option>
          {ratingSteps.map((step) => (
            <option key={step} value={String(step)}>
              {step} · {qualityWords[step]}
            </option>
          ))}
        </SelectField>
      </div>
      <div className="flex flex-col gap-1.5">
        <label htmlFor={notesId} className="text-sm font-semibold text-ink">
          {labels.notes}
        </label>
        <textarea
          id={notesId}
          rows={3}
          aria-invalid={e.notes ? true : undefined}
          aria-describedby={e.notes ? `${notesId}-error` : undefined}
          className={`block w-full rounded-md border bg-paper-raised px-3 py-2 text-[0.9375rem] text-ink focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none ${e.notes ? 'border-rust' : 'border-rule-strong'}`}
          {...register('notes')}
        />
        {e.notes && (
          <p id={`${notesId}-error`} className="text-[0.8125rem] font-medium text-rust">
            {e.notes.message}
          </p>
        )}
      </div>
    </div>
  );
}

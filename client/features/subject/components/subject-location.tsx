import { useQuery } from '@tanstack/react-query';
import { useWatch, type UseFormReturn } from 'react-hook-form';
import { TextField } from '../../../components/ui/field';
import { basemapQueries } from '../api/subject-queries';
import { neighbourhoodAt } from '../lib/neighbourhood-at';
import type { SubjectField, SubjectFormOutput, SubjectFormValues } from '../lib/subject-form';

type SubjectForm = UseFormReturn<SubjectFormValues, unknown, SubjectFormOutput>;

export function parseLocation(lonText: string, latText: string): { lon: number; lat: number } | null {
  if (lonText.trim() === '' || latText.trim() === '') return null;
  const lon = Number(lonText);
  const lat = Number(latText);
  if (!Number.isFinite(lon) || !Number.isFinite(lat) || Math.abs(lon) > 180 || Math.abs(lat) > 90) return null;
  return { lon, lat };
}

/**
 * Sets the location and fills the neighbourhood from the shipped boundaries. Only a location the
 * person gives (a click on the map, typed figures) fills it: opening or undoing the form does not
 * overwrite a neighbourhood that was typed by hand.
 */
export function useLocationFill(form: SubjectForm) {
  const boundaries = useQuery(basemapQueries.neighbourhoods());
  const fillFrom = (lonText: string, latText: string) => {
    const at = parseLocation(lonText, latText);
    if (!at || !boundaries.data) return;
    form.setValue('neighbourhood', neighbourhoodAt(boundaries.data, at.lon, at.lat) ?? '', { shouldDirty: true, shouldValidate: true });
  };
  const place = (at: { lon: number; lat: number }) => {
    form.setValue('lon', String(at.lon), { shouldDirty: true, shouldValidate: true });
    form.setValue('lat', String(at.lat), { shouldDirty: true, shouldValidate: true });
    fillFrom(String(at.lon), String(at.lat));
  };
  const isOutside = (at: { lon: number; lat: number } | null) => Boolean(at && boundaries.data && neighbourhoodAt(boundaries.data, at.lon, at.lat) === null);
  return { place, fillFrom, isOutside };
}

/** Longitude, latitude and neighbourhood fields under the map. */
export function SubjectLocationFields({ form, labels, fill }: { form: SubjectForm; labels: Record<SubjectField, string>; fill: ReturnType<typeof useLocationFill> }) {
  const { register, formState, control, getValues } = form;
  const e = formState.errors;
  const [lonText, latText] = useWatch({ control, name: ['lon', 'lat'] });
  const outside = fill.isOutside(parseLocation(lonText, latText));
  const typed = { onBlur: () => fill.fillFrom(getValues('lon'), getValues('lat')) };
  const numeric = { inputMode: 'decimal' as const, autoComplete: 'off', className: 'figures' };
  return (
    <div className="grid grid-cols-1 gap-x-4 gap-y-3.5 sm:grid-cols-2">
      <TextField label={labels.lon} {...numeric} error={e.lon?.message} {...register('lon', typed)} />
      <TextField label={labels.lat} {...numeric} error={e.lat?.message} {...register('lat', typed)} />
      <div className="sm:col-span-2">
        <TextField
          label={labels.neighbourhood}
          autoComplete="off"
          hint={outside ? 'Outside the mapped neighbourhoods: type one.' : 'Filled from the map’s boundaries when the location changes; you may type another.'}
          error={e.neighbourhood?.message}
          {...register('neighbourhood')}
        />
      </div>
    </div>
  );
}

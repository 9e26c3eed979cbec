import { z } from 'zod';
import { numberText, optionalText } from '../../../lib/form-text';
import { subjectInput, type Subject } from '@contracts/assignments';

/** The subject form holds text; this schema turns it into the contract's values and checks them
 * with the contract's own rules and messages (`subjectInput` in @contracts/assignments). */
const s = subjectInput.shape;
export const subjectFormSchema = z
  .object({
    lon: numberText(s.lon),
    lat: numberText(s.lat),
    neighbourhood: optionalText(s.neighbourhood),
    floorArea: numberText(s.floorArea),
    lotSize: numberText(s.lotSize),
    bedrooms: numberText(s.bedrooms),
    bathrooms: numberText(s.bathrooms),
    yearBuilt: numberText(s.yearBuilt),
    condition: numberText(s.condition),
    quality: numberText(s.quality),
    garageSpaces: numberText(s.garageSpaces),
    notes: optionalText(s.notes),
  })
  .superRefine((values, ctx) => {
    // A location is a pair: one coordinate without the other places nothing.
    if ((values.lon === null) !== (values.lat === null)) {
      ctx.addIssue({ code: 'custom', path: [values.lon === null ? 'lon' : 'lat'], message: 'Enter both longitude and latitude, or neither.' });
    }
  });

export type SubjectFormValues = z.input<typeof subjectFormSchema>;
export type SubjectFormOutput = z.output<typeof subjectFormSchema>;
export type SubjectField = keyof SubjectFormValues;
export const subjectFields: SubjectField[] = ['lon', 'lat', 'neighbourhood', 'floorArea', 'lotSize', 'bedrooms', 'bathrooms', 'yearBuilt', 'condition', 'quality', 'garageSpaces', 'notes'];

export function subjectToForm(subject: Subject): SubjectFormValues {
  const values = {} as SubjectFormValues;
  for (const field of subjectFields) {
    const value = subject[field];
    values[field] = value == null ? '' : String(value);
  }
  return values;
}

/** A blank neighbourhood with a location is left out, so that the server takes it from the map. */
export function subjectBody(values: SubjectFormOutput, version: number) {
  const { neighbourhood, ...rest } = values;
  const located = rest.lon !== null && rest.lat !== null;
  return neighbourhood || !located ? { ...rest, neighbourhood, version } : { ...rest, version };
}

export const subjectFieldLabels = (areaSymbol: string): Record<SubjectField, string> => ({
  lon: 'Longitude',
  lat: 'Latitude',
  neighbourhood: 'Neighbourhood',
  floorArea: `Gross living area (${areaSymbol})`,
  lotSize: `Lot size (${areaSymbol})`,
  bedrooms: 'Bedrooms',
  bathrooms: 'Bathrooms',
  yearBuilt: 'Year built',
  condition: 'Condition',
  quality: 'Quality',
  garageSpaces: 'Garage spaces',
  notes: 'Notes',
});

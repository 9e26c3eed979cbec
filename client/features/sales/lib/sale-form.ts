import { z } from 'zod';
import { numberText, optionalText } from '../../../lib/form-text';
import { saleFields, saleTypes, type Sale } from '@contracts/sales';
import type { SaleCreateInput } from '../api/sale-queries';

/**
 * The sale form holds text, as inputs do; this schema turns it into the contract's values and
 * checks them with the contract's own rules and messages (`saleFields` in @contracts/sales).
 */
const f = saleFields.shape;
export const saleFormSchema = z.object({
  address: f.address,
  lon: numberText(f.lon),
  lat: numberText(f.lat),
  neighbourhood: optionalText(f.neighbourhood),
  salePrice: numberText(f.salePrice),
  saleDate: f.saleDate,
  floorArea: numberText(f.floorArea),
  lotSize: numberText(f.lotSize),
  bedrooms: numberText(f.bedrooms),
  bathrooms: numberText(f.bathrooms),
  yearBuilt: numberText(f.yearBuilt),
  condition: numberText(f.condition),
  quality: numberText(f.quality),
  garageSpaces: numberText(f.garageSpaces),
  saleType: z.enum(saleTypes),
  sellerConcessions: numberText(f.sellerConcessions.nullable()).transform((v) => v ?? 0),
  dataSource: optionalText(f.dataSource),
  verificationNote: optionalText(f.verificationNote),
});

export type SaleFormValues = z.input<typeof saleFormSchema>;
export type SaleFormOutput = z.output<typeof saleFormSchema>;
export type SaleFormField = keyof SaleFormValues;
export const saleFormFields = Object.keys(saleFormSchema.shape) as SaleFormField[];

export const blankSaleForm: SaleFormValues = {
  address: '',
  lon: '',
  lat: '',
  neighbourhood: '',
  salePrice: '',
  saleDate: '',
  floorArea: '',
  lotSize: '',
  bedrooms: '',
  bathrooms: '',
  yearBuilt: '',
  condition: '',
  quality: '',
  garageSpaces: '',
  saleType: 'arms_length',
  sellerConcessions: '0',
  dataSource: '',
  verificationNote: '',
};

const asText = (value: number | string | null | undefined) => (value == null ? '' : String(value));

/** A saved sale as the form shows it. */
export function saleToForm(sale: Sale): SaleFormValues {
  const values = { ...blankSaleForm };
  for (const field of saleFormFields) {
    if (field === 'saleType') continue;
    values[field] = asText(sale[field]);
  }
  values.saleType = sale.saleType;
  return values;
}

/**
 * The request body. A blank neighbourhood is left out so that the server takes it from the map's
 * boundaries at the sale's location (on create, and on an edit that sends the location).
 */
export function saleBody(values: SaleFormOutput): SaleCreateInput {
  const { neighbourhood, ...rest } = values;
  return neighbourhood ? { ...rest, neighbourhood } : rest;
}

/** Human names of the fields, for the comparison shown after a conflicting save. */
export const saleFieldLabels: Record<SaleFormField, string> = {
  address: 'Address',
  lon: 'Longitude',
  lat: 'Latitude',
  neighbourhood: 'Neighbourhood',
  salePrice: 'Sale price',
  saleDate: 'Sale date',
  floorArea: 'Gross living area',
  lotSize: 'Lot size',
  bedrooms: 'Bedrooms',
  bathrooms: 'Bathrooms',
  yearBuilt: 'Year built',
  condition: 'Condition',
  quality: 'Quality',
  garageSpaces: 'Garage spaces',
  saleType: 'Sale type',
  sellerConcessions: 'Seller concessions',
  dataSource: 'Data source',
  verificationNote: 'Verification note',
};

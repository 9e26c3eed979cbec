import { z } from 'zod';
import { reconsiderationRequest } from '@contracts/reconsiderations';
import { saleCreate, saleTypes } from '@contracts/sales';

/**
 * The reconsideration form holds text, as inputs do. Each extra sale is turned into numbers and
 * then checked by the contract's own sale rules and messages (`saleCreate` in @contracts/sales),
 * so that the client meets exactly the checks the server applies.
 */
const numberOrUndefined = (text: string) => {
  const clean = text.replace(/[\s,]/g, '');
  return clean === '' ? undefined : Number(clean);
};
const textOrUndefined = (text: string) => (text.trim() === '' ? undefined : text.trim());

export const optionalSaleFields = ['neighbourhood', 'lotSize', 'bedrooms', 'bathrooms', 'yearBuilt', 'condition', 'quality', 'garageSpaces', 'lon', 'lat', 'verificationNote'] as const;

const saleText = z.object({
  address: z.string(),
  saleDate: z.string(),
  salePrice: z.string(),
  floorArea: z.string(),
  saleType: z.enum(saleTypes),
  sellerConcessions: z.string(),
  dataSource: z.string(),
  neighbourhood: z.string(),
  lotSize: z.string(),
  bedrooms: z.string(),
  bathrooms: z.string(),
  yearBuilt: z.string(),
  condition: z.string(),
  quality: z.string(),
  garageSpaces: z.string(),
  lon: z.string(),
  lat: z.string(),
  verificationNote: z.string(),
});
export type SaleText = z.infer<typeof saleText>;

const saleRow = saleText
  .transform(
    (s): z.input<typeof saleCreate> => ({
    address: s.address.trim(),
    saleDate: s.saleDate.trim(),
    salePrice: numberOrUndefined(s.salePrice),
    floorArea: numberOrUndefined(s.floorArea),
    saleType: s.saleType,
    sellerConcessions: numberOrUndefined(s.sellerConcessions),
    dataSource: textOrUndefined(s.dataSource),
    neighbourhood: textOrUndefined(s.neighbourhood),
    lotSize: numberOrUndefined(s.lotSize),
    bedrooms: numberOrUndefined(s.bedrooms),
    bathrooms: numberOrUndefined(s.bathrooms),
    yearBuilt: numberOrUndefined(s.yearBuilt),
    condition: numberOrUndefined(s.condition),
    quality: numberOrUndefined(s.quality),
    garageSpaces: numberOrUndefined(s.garageSpaces),
    lon: numberOrUndefined(s.lon),
    lat: numberOrUndefined(s.lat),
    verificationNote: textOrUndefined(s.verificationNote),
  }) as z.input<typeof saleCreate>,
  )
  .pipe(saleCreate);

export const reconsiderationFormSchema = z.object({
  comment: reconsiderationRequest.shape.comment,
  sales: z.array(saleRow).max(5, 'Up to five extra sales.'),
});
export type ReconsiderationFormValues = z.input<typeof reconsiderationFormSchema>;
export type ReconsiderationFormOutput = z.output<typeof reconsiderationFormSchema>;

export const MAX_EXTRA_SALES = 5;

export const blankSale = (): SaleText => ({
  address: '',
  saleDate: '',
  salePrice: '',
  floorArea: '',
  saleType: 'arms_length',
  sellerConcessions: '0',
  dataSource: '',
  neighbourhood: '',
  lotSize: '',
  bedrooms: '',
  bathrooms: '',
  yearBuilt: '',
  condition: '',
  quality: '',
  garageSpaces: '',
  lon: '',
  lat: '',
  verificationNote: '',
});

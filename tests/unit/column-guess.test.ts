import { describe, expect, it } from 'vitest';
import { guessMapping } from '../../server/modules/sales-import/column-guess';

describe('guessMapping', () => {
  it('maps the headers a typical sales export uses', () => {
    const headers = ['Property Address', 'Sale Price', 'Sale Date', 'GLA', 'Longitude', 'Latitude', 'Beds', 'Baths', 'Year Built', 'Lot Size'];
    expect(guessMapping(headers)).toEqual({
      address: 'Property Address',
      salePrice: 'Sale Price',
      saleDate: 'Sale Date',
      floorArea: 'GLA',
      lon: 'Longitude',
      lat: 'Latitude',
      bedrooms: 'Beds',
      bathrooms: 'Baths',
      yearBuilt: 'Year Built',
      lotSize: 'Lot Size',
    });
  });

  it('ignores case, underscores, dashes and brackets in headers', () => {
    expect(guessMapping(['ADDRESS', 'sale_price', 'Close-Date', 'Living Area (sq ft)', 'lng', 'LAT'])).toEqual({
      address: 'ADDRESS',
      salePrice: 'sale_price',
      saleDate: 'Close-Date',
      floorArea: 'Living Area (sq ft)',
      lon: 'lng',
      lat: 'LAT',
    });
  });

  it('prefers an exact header over one that merely contains the word', () => {
    const mapping = guessMapping(['List Date', 'Sale Date', 'Address']);
    expect(mapping.saleDate).toBe('Sale Date');
  });

  it('uses each header for one field at most', () => {
    const mapping = guessMapping(['Address', 'Price', 'Date', 'Area', 'Lot SqFt', 'Living SqFt', 'Notes']);
    const used = Object.values(mapping);
    expect(new Set(used).size).toBe(used.length);
    expect(mapping.lotSize).toBe('Lot SqFt');
    expect(mapping.floorArea).not.toBe('Lot SqFt');
  });

  it('leaves unknown headers unmapped', () => {
    expect(guessMapping(['Where', 'Paid', 'Heated Space', 'Agent Phone'])).toEqual({});
    expect(guessMapping([])).toEqual({});
  });

  it('takes the user’s saved mapping first where its headers are in the file', () => {
    const saved = { salePrice: 'Paid', address: 'Where', floorArea: 'Heated Space' };
    const mapping = guessMapping(['Where', 'Paid', 'Sale Price', 'Heated Space', 'Sale Date'], saved);
    expect(mapping).toMatchObject({ address: 'Where', salePrice: 'Paid', floorArea: 'Heated Space', saleDate: 'Sale Date' });
  });

  it('falls back to guessing for a saved header this file does not have', () => {
    const mapping = guessMapping(['Address', 'Sale Price', 'Sale Date', 'GLA'], { salePrice: 'Paid', address: 'Where' });
    expect(mapping).toMatchObject({ address: 'Address', salePrice: 'Sale Price', saleDate: 'Sale Date', floorArea: 'GLA' });
    expect(Object.values(mapping)).not.toContain('Paid');
  });

  it('does not let a saved mapping reuse one header for two fields', () => {
    const mapping = guessMapping(['Where', 'Paid'], { address: 'Where', dataSource: 'Where', salePrice: 'Paid' });
    expect(mapping.address).toBe('Where');
    expect(mapping.dataSource).toBeUndefined();
    expect(mapping.salePrice).toBe('Paid');
  });
});

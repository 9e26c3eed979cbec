import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { distance, point } from '@turf/turf';
import { compareEditsWithServer, fieldsChangedElsewhere, rebaseEdits } from '../../client/lib/edit-conflict';
import { blankSaleForm, saleBody, saleFormSchema } from '../../client/features/sales/lib/sale-form';
import { subjectBody, subjectFormSchema } from '../../client/features/subject/lib/subject-form';
import { neighbourhoodAt, type NeighbourhoodBoundaries } from '../../client/features/subject/lib/neighbourhood-at';
import { outerRingBounds, ringLabelPoints, ringPolygons, ringRadii } from '../../client/features/comp-map/lib/rings';

const boundaries = JSON.parse(readFileSync('public/basemap/neighbourhoods.geojson', 'utf8')) as NeighbourhoodBoundaries;
const blankSubject = { lon: '', lat: '', neighbourhood: '', floorArea: '', lotSize: '', bedrooms: '', bathrooms: '', yearBuilt: '', condition: '', quality: '', garageSpaces: '', notes: '' };

describe('the sale form', () => {
  it('reports the contract’s own messages for missing figures and its own for text that is not a number', () => {
    const result = saleFormSchema.safeParse({ ...blankSaleForm, floorArea: 'about 1800' });
    expect(result.success).toBe(false);
    // The first message of each field, as the form and the server's error handler both show it.
    const messages: Record<string, string> = {};
    for (const issue of result.error!.issues) messages[String(issue.path[0])] ??= issue.message;
    expect(messages.address).toBe('Enter the address.');
    expect(messages.salePrice).toBe('Enter the sale price as a number.');
    expect(messages.floorArea).toBe('Enter a number.');
    expect(messages.saleDate).toBe('Use a date like 2026-11-15.');
  });

  it('turns text into the contract’s values and leaves a blank neighbourhood for the server to fill', () => {
    const parsed = saleFormSchema.parse({ ...blankSaleForm, address: ' 7 Quay Street ', salePrice: '412,000', saleDate: '2026-08-14', floorArea: '1760', lon: '-61.4', lat: '44.7', sellerConcessions: '' });
    expect(parsed).toMatchObject({ address: '7 Quay Street', salePrice: 412_000, floorArea: 1_760, lotSize: null, sellerConcessions: 0, neighbourhood: null });
    const body = saleBody(parsed);
    expect('neighbourhood' in body).toBe(false);
    expect(saleBody({ ...parsed, neighbourhood: 'Tannery Row' }).neighbourhood).toBe('Tannery Row');
  });
});

describe('the subject form', () => {
  it('asks for both coordinates or neither, with the contract’s range messages', () => {
    const half = subjectFormSchema.safeParse({ ...blankSubject, lon: '-61.4' });
    expect(half.error?.issues.map((i) => [i.path[0], i.message])).toEqual([['lat', 'Enter both longitude and latitude, or neither.']]);
    const far = subjectFormSchema.safeParse({ ...blankSubject, lon: '-200', lat: '44.7' });
    expect(far.error?.issues[0].message).toBe('Longitude must be between −180 and 180.');
    const rating = subjectFormSchema.safeParse({ ...blankSubject, condition: '7' });
    expect(rating.error?.issues[0].message).toBe('Ratings run from 1 (best) to 6.');
  });

  it('omits a blank neighbourhood when there is a location, so that the server takes it from the map', () => {
    const located = subjectFormSchema.parse({ ...blankSubject, lon: '-61.414137', lat: '44.706416', floorArea: '1850' });
    expect(subjectBody(located, 3)).toEqual(expect.not.objectContaining({ neighbourhood: expect.anything() }));
    expect(subjectBody(located, 3)).toMatchObject({ version: 3, floorArea: 1_850, lon: -61.414137 });
    const unlocated = subjectFormSchema.parse(blankSubject);
    expect(subjectBody(unlocated, 3)).toMatchObject({ neighbourhood: null });
  });

  it('finds the neighbourhood of a point from the shipped boundaries, and none out at sea', () => {
    expect(neighbourhoodAt(boundaries, -61.414137, 44.706416)).toBe('Quarry Hill');
    expect(neighbourhoodAt(boundaries, -61.385, 44.699)).toBe('Tannery Row');
    expect(neighbourhoodAt(boundaries, -61.40, 44.690)).toBeNull();
  });
});

describe('a save that lost the race (409)', () => {
  const started = { floorArea: '1850', bedrooms: '3', notes: 'quiet lane' };

  it('lists each edited field with what was typed and what is saved now, marking the ones changed by the other save', () => {
    const yours = { floorArea: '1900', bedrooms: '4', notes: 'quiet lane' };
    const now = { floorArea: '1875', bedrooms: '3', notes: 'corner plot' };
    expect(compareEditsWithServer(['floorArea', 'bedrooms'], started, yours, now)).toEqual([
      { field: 'floorArea', started: '1850', yours: '1900', now: '1875', changedSince: true },
      { field: 'bedrooms', started: '3', yours: '4', now: '3', changedSince: false },
    ]);
    expect(fieldsChangedElsewhere(['floorArea', 'bedrooms', 'notes'], ['floorArea', 'bedrooms'], started, now)).toEqual(['notes']);
  });

  it('carries the typing over onto the saved version: nothing typed is lost', () => {
    const rebased = rebaseEdits(['bedrooms'], { ...started, bedrooms: '4' }, { floorArea: '1875', bedrooms: '3', notes: 'corner plot' });
    expect(rebased).toEqual({ floorArea: '1875', bedrooms: '4', notes: 'corner plot' });
  });
});

describe('distance rings', () => {
  const subject = { lon: -61.414137, lat: 44.706416 };

  it('are half a mile and a mile for square feet, one and two kilometres for square metres', () => {
    expect(ringRadii('sqft')).toEqual({ radii: [0.5, 1], units: 'miles' });
    expect(ringRadii('sqm')).toEqual({ radii: [1, 2], units: 'kilometers' });
    const [inner, outer] = ringPolygons(subject, 'sqm').features;
    const edge = (ring: typeof inner) => distance(point([subject.lon, subject.lat]), point(ring.geometry.coordinates[0][0]), { units: 'kilometers' });
    expect(edge(inner)).toBeCloseTo(1, 3);
    expect(edge(outer)).toBeCloseTo(2, 3);
  });

  it('put their labels on the rings and frame the outer one', () => {
    for (const { radius, at } of ringLabelPoints(subject, 'sqft')) {
      expect(distance(point([subject.lon, subject.lat]), point(at), { units: 'miles' })).toBeCloseTo(radius, 4);
    }
    const [west, south, east, north] = outerRingBounds(subject, 'sqft');
    expect(west).toBeLessThan(subject.lon);
    expect(east).toBeGreaterThan(subject.lon);
    expect((north - south) * 69.05).toBeCloseTo(2, 1);
  });
});

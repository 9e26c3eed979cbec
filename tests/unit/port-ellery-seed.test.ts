import { readFileSync, statSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { booleanPointInPolygon, lineString, point, pointToLineDistance, polygon } from '@turf/turf';
import type { FeatureCollection, LineString, Polygon } from 'geojson';
import { linearRegression, sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { generatePortEllery, type PortEllerySale } from '../../db/seed/port-ellery';
import { createRandom } from '../../db/seed/random';
import { DEMO_REVIEW_GRID_SALES } from '../../db/seed/seed-review-assignment';
import type { NeighbourhoodModel } from '../../db/seed/port-ellery-model';

const basemapDir = fileURLToPath(new URL('../../public/basemap', import.meta.url));
const readCollection = <G extends LineString | Polygon>(file: string) =>
  JSON.parse(readFileSync(join(basemapDir, file), 'utf8')) as FeatureCollection<G, Record<string, string>>;
const streetsMap = readCollection<LineString>('streets.geojson');
const neighbourhoodsMap = readCollection<Polygon>('neighbourhoods.geojson');

const scenario = generatePortEllery();
const { sales, plantedAnomalies, subject, reviewSubject } = scenario;
const quarryHill = scenario.neighbourhoods.find((n) => n.slug === 'quarry-hill')!;

const DAY = 86_400_000;
/** The stated model, written out again from its description: (a + b·A)·(1 + g)^(−months). */
function statedModelPrice(n: NeighbourhoodModel, area: number, saleDate: string): number {
  const months = (Date.UTC(2026, 10, 15) - Date.parse(`${saleDate}T00:00:00Z`)) / DAY / (365.25 / 12);
  return (n.priceLevel + n.pricePerSqFt * area) / Math.pow(1 + n.monthlyTrend, months);
}
const streetOf = (address: string) => address.replace(/^\d+\s+/, '');
const saleByKey = (key: string) => sales.find((s) => s.key === key);
const anomaly = (kind: string) => {
  const found = plantedAnomalies.filter((a) => a.kind === kind);
  expect(found).toHaveLength(1);
  const sale = saleByKey(found[0].saleKey);
  expect(sale).toBeDefined();
  return sale as PortEllerySale;
};

describe('generatePortEllery', () => {
  it('gives identical output for the same seed and different sales for another seed', () => {
    expect(generatePortEllery()).toEqual(scenario);
    expect(generatePortEllery(20261115)).toEqual(scenario);
    expect(generatePortEllery(42)).toEqual(generatePortEllery(42));
    expect(generatePortEllery(42).sales).not.toEqual(sales);
  });

  it('has about 150 sales, about 37 in each neighbourhood, with unique PE keys', () => {
    expect(sales.length).toBeGreaterThanOrEqual(145);
    expect(sales.length).toBeLessThanOrEqual(155);
    for (const slug of ['quarry-hill', 'tannery-row', 'saltmarsh-flats', 'orchard-rise']) {
      const count = sales.filter((s) => s.neighbourhood === slug).length;
      expect(count, slug).toBeGreaterThanOrEqual(34);
      expect(count, slug).toBeLessThanOrEqual(40);
    }
    expect(new Set(sales.map((s) => s.key)).size).toBe(sales.length);
    for (const s of sales) expect(s.key).toMatch(/^PE-\d{4}$/);
  });

  it('puts every sale inside the basemap polygon of its own neighbourhood', () => {
    for (const s of sales) {
      const area = neighbourhoodsMap.features.find((f) => f.properties.slug === s.neighbourhood);
      expect(area, s.neighbourhood).toBeDefined();
      expect(booleanPointInPolygon(point([s.lon, s.lat]), area!), `${s.key} ${s.address}`).toBe(true);
    }
  });

  it('dates every sale within the 18 months before 2026-11-15', () => {
    for (const s of sales) {
      expect(s.saleDate).toMatch(/^\d{4}-\d{2}-\d{2}$/);
      expect(new Date(`${s.saleDate}T00:00:00Z`).toISOString().slice(0, 10)).toBe(s.saleDate);
      expect(s.saleDate >= '2025-05-15', s.key).toBe(true);
      expect(s.saleDate < '2026-11-15', s.key).toBe(true);
    }
    // Spread over the window, not bunched at one end.
    expect(sales.some((s) => s.saleDate < '2025-09-01')).toBe(true);
    expect(sales.some((s) => s.saleDate > '2026-08-01')).toBe(true);
  });

  it('addresses every sale on a basemap street, near that street, and never twice', () => {
    const streets = new Map(streetsMap.features.map((f) => [f.properties.name, f]));
    expect(streets.has('Lantern Lane')).toBe(true);
    expect(streets.has('Gull Street')).toBe(true);
    for (const s of sales) {
      expect(s.address).toMatch(/^[1-9]\d* [A-Z][A-Za-z ]+$/);
      const street = streets.get(streetOf(s.address));
      expect(street, s.address).toBeDefined();
      const metres = pointToLineDistance(point([s.lon, s.lat]), lineString(street!.geometry.coordinates), { units: 'meters' });
      expect(metres, s.address).toBeLessThan(100);
    }
    const addresses = [...sales.map((s) => s.address), subject.address, reviewSubject.address];
    expect(new Set(addresses).size).toBe(addresses.length);
  });

  it('fills every sale field with a plausible value', () => {
    const saleTypes = ['arms-length', 'distressed', 'family', 'estate', 'new-construction', 'other'];
    for (const s of sales) {
      expect(s.salePrice % 500, s.key).toBe(0);
      expect(s.salePrice).toBeGreaterThan(50_000);
      expect(Number.isInteger(s.floorArea) && s.floorArea > 400).toBe(true);
      expect(s.lotSize).toBeGreaterThan(1_000);
      expect(Number.isInteger(s.bathrooms * 2) && s.bathrooms >= 1).toBe(true);
      expect(s.bedrooms).toBeGreaterThanOrEqual(1);
      for (const rating of [s.condition, s.quality]) expect([1, 2, 3, 4, 5, 6]).toContain(rating);
      expect(s.yearBuilt).toBeGreaterThan(1850);
      expect(s.yearBuilt).toBeLessThanOrEqual(Number(s.saleDate.slice(0, 4)));
      expect(saleTypes).toContain(s.saleType);
      expect(s.sellerConcessions).toBeGreaterThanOrEqual(0);
      expect(s.dataSource).toMatch(/invented/);
      expect(s.verificationNote.length).toBeGreaterThan(10);
    }
    expect(sales.filter((s) => s.sellerConcessions === 0).length).toBeGreaterThan(sales.length / 2);
  });

  it('places the subject, 14 Lantern Lane, inside Quarry Hill', () => {
    expect(subject.address).toBe('14 Lantern Lane');
    expect(subject.neighbourhood).toBe('quarry-hill');
    expect(booleanPointInPolygon(point([subject.lon, subject.lat]), polygon([quarryHill.polygon]))).toBe(true);
    expect(subject.floorArea).toBeGreaterThanOrEqual(1_800);
    expect(subject.floorArea).toBeLessThanOrEqual(1_900);
    expect(subject).toMatchObject({ bedrooms: 3, bathrooms: 2 });
  });
});

describe('the subject of the demo file already in review', () => {
  const cobbleLane = streetsMap.features.find((f) => f.properties.name === 'Cobble Lane')!;

  it('stands on the odd (west) side of Cobble Lane, near it, inside Quarry Hill', () => {
    expect(reviewSubject.address).toBe('9 Cobble Lane');
    expect(reviewSubject.neighbourhood).toBe('quarry-hill');
    expect(booleanPointInPolygon(point([reviewSubject.lon, reviewSubject.lat]), polygon([quarryHill.polygon]))).toBe(true);
    const metres = pointToLineDistance(point([reviewSubject.lon, reviewSubject.lat]), lineString(cobbleLane.geometry.coordinates), { units: 'meters' });
    expect(metres).toBeGreaterThan(10);
    expect(metres).toBeLessThan(25);
    // The lane runs north, so its left-hand (odd) side lies west of it.
    const [laneLon] = cobbleLane.geometry.coordinates[0];
    expect(reviewSubject.lon).toBeLessThan(laneLon);
  });

  it('is another house than 14 Lantern Lane, an ordinary Quarry Hill one', () => {
    expect(reviewSubject).not.toEqual(subject);
    expect(reviewSubject.floorArea).toBeGreaterThan(quarryHill.floorArea.mean - quarryHill.floorArea.sd);
    expect(reviewSubject.floorArea).toBeLessThan(quarryHill.floorArea.mean + quarryHill.floorArea.sd);
    expect(reviewSubject.yearBuilt).toBeGreaterThanOrEqual(quarryHill.yearBuilt.from);
    expect(reviewSubject.yearBuilt).toBeLessThanOrEqual(quarryHill.yearBuilt.to);
  });

  it('has grid sales that are recent arm’s-length Quarry Hill sales around its floor area, none of them planted', () => {
    const planted = new Set(plantedAnomalies.map((a) => a.saleKey));
    const grid = DEMO_REVIEW_GRID_SALES.map((address) => sales.find((s) => s.address === address));
    for (const [i, sale] of grid.entries()) {
      expect(sale, DEMO_REVIEW_GRID_SALES[i]).toBeDefined();
      expect(sale!.neighbourhood).toBe('quarry-hill');
      expect(sale!.saleType).toBe('arms-length');
      expect(planted.has(sale!.key)).toBe(false);
      expect(sale!.saleDate >= '2025-11-15', sale!.address).toBe(true);
    }
    const areas = grid.map((s) => s!.floorArea);
    expect(Math.min(...areas)).toBeLessThan(reviewSubject.floorArea);
    expect(Math.max(...areas)).toBeGreaterThan(reviewSubject.floorArea);
  });
});

describe('planted anomalies', () => {
  it('records each of the four kinds once, all in Quarry Hill, with a description', () => {
    expect(plantedAnomalies.map((a) => a.kind).sort()).toEqual(['distressed-sale', 'family-transfer', 'floor-area-typo', 'tear-down']);
    for (const a of plantedAnomalies) {
      expect(saleByKey(a.saleKey)?.neighbourhood).toBe('quarry-hill');
      expect(a.description.length).toBeGreaterThan(20);
    }
  });

  it('has no unrecorded family, distressed or other sales', () => {
    const planted = new Set(plantedAnomalies.map((a) => a.saleKey));
    const odd = sales.filter((s) => ['family', 'distressed', 'other'].includes(s.saleType) && !planted.has(s.key));
    expect(odd).toEqual([]);
  });

  it('sells the family transfer at about 60% of the model price', () => {
    const sale = anomaly('family-transfer');
    expect(sale.saleType).toBe('family');
    const ratio = sale.salePrice / statedModelPrice(quarryHill, sale.floorArea, sale.saleDate);
    expect(ratio).toBeGreaterThanOrEqual(0.54);
    expect(ratio).toBeLessThanOrEqual(0.66);
  });

  it('sells the distressed sale 25–30% below the model price', () => {
    const sale = anomaly('distressed-sale');
    expect(sale.saleType).toBe('distressed');
    const ratio = sale.salePrice / statedModelPrice(quarryHill, sale.floorArea, sale.saleDate);
    expect(ratio).toBeGreaterThanOrEqual(0.69);
    expect(ratio).toBeLessThanOrEqual(0.76);
  });

  it('keys the typo sale with ten times its area but prices it normally for the true area', () => {
    const sale = anomaly('floor-area-typo');
    expect(sale.floorArea).toBeGreaterThanOrEqual(5 * quarryHill.floorArea.mean);
    expect(sale.floorArea % 10).toBe(0);
    const ratio = sale.salePrice / statedModelPrice(quarryHill, sale.floorArea / 10, sale.saleDate);
    expect(ratio).toBeGreaterThan(0.8);
    expect(ratio).toBeLessThan(1.2);
  });

  it('records the tear-down as an old, uninhabitable house bought for its land', () => {
    const sale = anomaly('tear-down');
    expect(sale).toMatchObject({ saleType: 'other', condition: 6 });
    expect(sale.yearBuilt).toBeLessThan(1940);
    expect(sale.verificationNote).toContain('bought for land value, house demolished');
    expect(sale.salePrice / statedModelPrice(quarryHill, sale.floorArea, sale.saleDate)).toBeLessThan(0.6);
  });
});

describe('the market the sales describe', () => {
  const planted = new Set(plantedAnomalies.map((a) => a.saleKey));
  const fit = (group: PortEllerySale[]) => {
    const points = group.map((s) => [s.floorArea, s.salePrice]);
    const line = linearRegression(points);
    const residuals = group.map((s) => s.salePrice - (line.m * s.floorArea + line.b));
    const s = Math.sqrt(residuals.reduce((sum, e) => sum + e * e, 0) / (group.length - 2));
    return { line, s, r: sampleCorrelation(points.map((p) => p[0]), points.map((p) => p[1])) };
  };

  it('gives a strong price–area line in Quarry Hill once the anomalies are set aside', () => {
    const clean = sales.filter((s) => s.neighbourhood === 'quarry-hill' && !planted.has(s.key));
    const { line, r } = fit(clean);
    expect(r).toBeGreaterThan(0.9);
    expect(line.m).toBeGreaterThan(0.75 * quarryHill.pricePerSqFt);
    expect(line.m).toBeLessThan(1.25 * quarryHill.pricePerSqFt);
  });

  it('leaves every planted anomaly far below the clean Quarry Hill line', () => {
    const clean = sales.filter((s) => s.neighbourhood === 'quarry-hill' && !planted.has(s.key));
    const { line, s } = fit(clean);
    for (const a of plantedAnomalies) {
      const sale = saleByKey(a.saleKey)!;
      const standardised = (sale.salePrice - (line.m * sale.floorArea + line.b)) / s;
      expect(standardised, a.kind).toBeLessThan(-3);
    }
  });

  it('gives every other neighbourhood a usable line too', () => {
    for (const slug of ['tannery-row', 'saltmarsh-flats', 'orchard-rise']) {
      expect(fit(sales.filter((s) => s.neighbourhood === slug)).r, slug).toBeGreaterThan(0.7);
    }
  });
});

describe('shipped basemap', () => {
  it('draws exactly the model neighbourhoods, with slug and name', () => {
    const drawn = neighbourhoodsMap.features.map((f) => ({ slug: f.properties.slug, name: f.properties.name, ring: f.geometry.coordinates[0] }));
    expect(drawn).toEqual(scenario.neighbourhoods.map((n) => ({ slug: n.slug, name: n.name, ring: n.polygon })));
    expect(drawn.map((d) => d.name).sort()).toEqual(['Orchard Rise', 'Quarry Hill', 'Saltmarsh Flats', 'Tannery Row']);
  });

  it('stays small', () => {
    const bytes = readdirSync(basemapDir).reduce((sum, file) => sum + statSync(join(basemapDir, file)).size, 0);
    expect(bytes).toBeLessThan(200 * 1024);
  });
});

describe('createRandom', () => {
  it('repeats its stream for a seed and keeps helpers within their ranges', () => {
    const a = createRandom(7);
    const b = createRandom(7);
    const first = Array.from({ length: 5 }, () => a.next());
    expect(Array.from({ length: 5 }, () => b.next())).toEqual(first);
    expect(new Set(first).size).toBe(5);
    const dice = Array.from({ length: 2_000 }, () => a.integer(1, 6));
    expect(new Set(dice)).toEqual(new Set([1, 2, 3, 4, 5, 6]));
    const draws = Array.from({ length: 20_000 }, () => a.normal(100, 15));
    const mean = draws.reduce((sum, x) => sum + x, 0) / draws.length;
    const sd = Math.sqrt(draws.reduce((sum, x) => sum + (x - mean) ** 2, 0) / (draws.length - 1));
    expect(Math.abs(mean - 100)).toBeLessThan(0.5); // standard error 15/√20000 ≈ 0.11
    expect(Math.abs(sd - 15)).toBeLessThan(0.5);
    expect(['x', 'y']).toContain(a.pick(['x', 'y']));
    expect(() => a.pick([])).toThrow(RangeError);
  });
});

/**
 * The stated model behind the Port Ellery demo data. Port Ellery is an invented harbour town; its
 * coastline, streets and neighbourhoods are drawn for this product and copy no real map.
 *
 * Geography. The town sits around a harbour bay that opens to the sea in the south. Positions are
 * written here as kilometre offsets east (x) and north (y) of the town centre at longitude -61.40,
 * latitude 44.70, and converted to lon/lat with a local flat-earth scale (good to well under a metre
 * over a town this size). Four neighbourhoods ring the harbour: Saltmarsh Flats (low ground west of
 * the bay), Tannery Row (old waterfront terraces east of it), Quarry Hill (rising ground to the
 * north-west, where the demo subject stands) and Orchard Rise (newer houses to the north-east).
 *
 * Prices. For a sale in neighbourhood k with floor area A (ft²), closed m months before the
 * effective date, the market price is
 *
 *     price = (level_k + slope_k · A) · (1 + trend_k)^(−m)  +  ε,   ε ~ Normal(0, residualSd_k)
 *
 * so older sales are cheaper; recorded prices are rounded to the nearest 500 USD. Floor areas are
 * drawn from Normal(mean_k, sd_k); lot size, age, condition and quality vary around the stated
 * typical values but do not enter the price (the market here pays for floor area and time only,
 * which is what lets the demo's line fit be judged against a known truth).
 *
 * Condition and quality use Compline's own six-step scales, 1 best:
 *   condition 1 new or as new · 2 well kept, little wear · 3 ordinary wear, minor repairs due ·
 *             4 worn, several parts need repair · 5 substantial repairs needed · 6 not habitable as is
 *   quality   1 architect-designed, finest materials · 2 high · 3 good standard · 4 plain standard ·
 *             5 basic, economy materials · 6 minimal, below building norms
 */

export const EFFECTIVE_DATE = '2026-11-15';
/** Sales are drawn from the 18 months up to (not including) the effective date. */
export const SALES_WINDOW_MONTHS = 18;
export const CURRENCY = 'USD';
export const AREA_UNIT = 'sqft';
/** Average month length, for converting day counts to months before the effective date. */
export const DAYS_PER_MONTH = 365.25 / 12;
export const DATA_SOURCES = [
  'Port Ellery registry of deeds (invented)',
  'Port Ellery multiple listing exchange (invented)',
] as const;

export const TOWN_CENTRE = { lon: -61.4, lat: 44.7 } as const;
const KM_PER_DEGREE_LAT = 110.57;
const KM_PER_DEGREE_LON = 111.32 * Math.cos((TOWN_CENTRE.lat * Math.PI) / 180);

export type LonLat = [number, number];

/** Converts a kilometre offset from the town centre to a [lon, lat] pair rounded to 6 decimals. */
export function lonLatFromLocalKm(x: number, y: number): LonLat {
  const round6 = (value: number) => Math.round(value * 1e6) / 1e6;
  return [round6(TOWN_CENTRE.lon + x / KM_PER_DEGREE_LON), round6(TOWN_CENTRE.lat + y / KM_PER_DEGREE_LAT)];
}

/** A closed lon/lat ring (first point repeated at the end) from kilometre offsets. */
export function ringFromLocalKm(points: ReadonlyArray<readonly [number, number]>): LonLat[] {
  const ring = points.map(([x, y]) => lonLatFromLocalKm(x, y));
  return [...ring, ring[0]];
}

export interface NeighbourhoodModel {
  slug: 'quarry-hill' | 'tannery-row' | 'saltmarsh-flats' | 'orchard-rise';
  name: string;
  /** Outer ring, lon/lat, closed. */
  polygon: LonLat[];
  /** Intercept of the price line, USD. */
  priceLevel: number;
  /** Slope of the price line, USD per ft². */
  pricePerSqFt: number;
  /** Compound price change per month (0.004 = +0.4% a month). */
  monthlyTrend: number;
  floorArea: { mean: number; sd: number };
  /** Standard deviation of the price noise ε, USD. */
  residualSd: number;
  /** How many sales the generator draws here (anomalies included). */
  salesCount: number;
  /** Lot size varies as median · exp(Normal(0, logSd)), ft². */
  lotSize: { median: number; logSd: number };
  yearBuilt: { from: number; to: number };
  typicalQuality: number;
  garageSpaces: readonly number[];
}

export const NEIGHBOURHOODS: readonly NeighbourhoodModel[] = [
  {
    slug: 'quarry-hill',
    name: 'Quarry Hill',
    polygon: ringFromLocalKm([
      [-1.6, 0.4], [-1.0, 0.44], [-0.62, 0.42], [-0.05, 0.44], [0.0, 0.8], [0.05, 1.3], [-0.8, 1.35], [-1.6, 1.3],
    ]),
    priceLevel: 55_000,
    pricePerSqFt: 240,
    monthlyTrend: 0.004,
    floorArea: { mean: 1_750, sd: 340 },
    residualSd: 16_000,
    salesCount: 38,
    lotSize: { median: 7_400, logSd: 0.22 },
    yearBuilt: { from: 1908, to: 1978 },
    typicalQuality: 3,
    garageSpaces: [0, 1, 1, 1, 2, 2],
  },
  {
    slug: 'tannery-row',
    name: 'Tannery Row',
    polygon: ringFromLocalKm([
      [0.62, 0.44], [0.66, 0.2], [0.74, 0.0], [0.74, -0.5], [1.6, -0.5], [1.6, 0.4], [1.0, 0.44],
    ]),
    priceLevel: 35_000,
    pricePerSqFt: 185,
    monthlyTrend: 0.006,
    floorArea: { mean: 1_400, sd: 280 },
    residualSd: 24_000,
    salesCount: 37,
    lotSize: { median: 3_100, logSd: 0.25 },
    yearBuilt: { from: 1884, to: 1935 },
    typicalQuality: 4,
    garageSpaces: [0, 0, 0, 0, 1],
  },
  {
    slug: 'saltmarsh-flats',
    name: 'Saltmarsh Flats',
    polygon: ringFromLocalKm([
      [-1.6, -0.5], [-0.74, -0.5], [-0.74, 0.0], [-0.66, 0.2], [-0.62, 0.42], [-1.0, 0.44], [-1.6, 0.4],
    ]),
    priceLevel: 25_000,
    pricePerSqFt: 195,
    monthlyTrend: 0.002,
    floorArea: { mean: 1_550, sd: 320 },
    residualSd: 20_000,
    salesCount: 38,
    lotSize: { median: 5_600, logSd: 0.2 },
    yearBuilt: { from: 1952, to: 1996 },
    typicalQuality: 4,
    garageSpaces: [0, 1, 1, 1, 2],
  },
  {
    slug: 'orchard-rise',
    name: 'Orchard Rise',
    polygon: ringFromLocalKm([
      [-0.05, 0.44], [0.62, 0.44], [1.0, 0.44], [1.6, 0.4], [1.6, 1.3], [0.8, 1.35], [0.05, 1.3], [0.0, 0.8],
    ]),
    priceLevel: 80_000,
    pricePerSqFt: 300,
    monthlyTrend: 0.005,
    floorArea: { mean: 2_150, sd: 420 },
    residualSd: 30_000,
    salesCount: 37,
    lotSize: { median: 10_500, logSd: 0.2 },
    yearBuilt: { from: 1986, to: 2026 },
    typicalQuality: 2,
    garageSpaces: [1, 2, 2, 2, 3],
  },
];

export interface StreetModel {
  name: string;
  kind: 'main' | 'residential';
  /** lon/lat vertices from one end of the street to the other; house numbers count from the first. */
  path: LonLat[];
}

const street = (name: string, kind: StreetModel['kind'], km: ReadonlyArray<readonly [number, number]>): StreetModel => ({
  name,
  kind,
  path: km.map(([x, y]) => lonLatFromLocalKm(x, y)),
});

/** Every street in town. Sale addresses use only these names; the basemap draws these lines. */
export const STREETS: readonly StreetModel[] = [
  // Main roads
  street('Harbour Road', 'main', [[0.0, 0.22], [0.01, 0.6], [-0.02, 0.95], [0.02, 1.3], [0.05, 1.75]]),
  street('Quay Street', 'main', [[-0.62, 0.24], [-0.3, 0.28], [0.0, 0.3], [0.3, 0.28], [0.62, 0.24]]),
  street('Ridge Road', 'main', [[-2.2, 1.78], [-1.0, 1.74], [0.05, 1.75], [1.0, 1.7], [2.2, 1.76]]),
  street('Seawall Road', 'main', [[-1.8, -0.56], [-1.4, -0.45], [-1.0, -0.47], [-0.72, -0.45]]),
  street('Dock Street', 'main', [[0.72, -0.45], [1.1, -0.48], [1.5, -0.46], [1.9, -0.57]]),
  street('West Shore Road', 'main', [[-0.62, 0.24], [-0.68, 0.05], [-0.71, -0.25], [-0.72, -0.45]]),
  street('Wharf Street', 'main', [[0.62, 0.24], [0.68, 0.05], [0.71, -0.25], [0.72, -0.45]]),
  // Quarry Hill
  street('Hillside Avenue', 'residential', [[-1.6, 0.5], [-1.0, 0.53], [-0.5, 0.5], [-0.02, 0.51]]),
  street('Lantern Lane', 'residential', [[-1.25, 0.71], [-0.95, 0.75], [-0.65, 0.72], [-0.35, 0.67], [-0.02, 0.69]]),
  street('Flint Street', 'residential', [[-1.55, 0.94], [-1.0, 0.96], [-0.5, 0.95], [-0.02, 0.96]]),
  street('Mason Street', 'residential', [[-1.5, 1.2], [-1.0, 1.2], [-0.5, 1.21], [0.02, 1.22]]),
  street('Gull Street', 'residential', [[-1.0, -0.45], [-1.02, 0.0], [-1.0, 0.4], [-1.0, 0.8], [-1.02, 1.25]]),
  street('Quarry Road', 'residential', [[-0.45, 0.5], [-0.6, 0.8], [-0.8, 1.1], [-0.95, 1.4], [-1.05, 1.55]]),
  street('Ledge Street', 'residential', [[-1.4, 0.5], [-1.42, 0.8], [-1.4, 1.2]]),
  street('Cobble Lane', 'residential', [[-0.25, 0.5], [-0.28, 0.72], [-0.26, 0.95]]),
  // Saltmarsh Flats
  street('Reed Street', 'residential', [[-1.6, 0.22], [-1.2, 0.2], [-0.68, 0.18]]),
  street('Heron Way', 'residential', [[-1.6, -0.08], [-1.3, -0.02], [-1.0, -0.1], [-0.71, -0.06]]),
  street('Cordgrass Lane', 'residential', [[-1.3, -0.45], [-1.31, 0.0], [-1.3, 0.4]]),
  // Tannery Row
  street('Tanner Street', 'residential', [[0.68, 0.2], [1.1, 0.22], [1.6, 0.2]]),
  street('Ropewalk', 'residential', [[0.71, -0.12], [1.15, -0.1], [1.6, -0.14]]),
  street('Bark Lane', 'residential', [[1.0, -0.47], [1.0, 0.0], [1.0, 0.4]]),
  street('Mill Street', 'residential', [[1.35, -0.46], [1.33, 0.4], [1.35, 0.9]]),
  // Orchard Rise
  street('Pippin Lane', 'residential', [[0.05, 0.6], [0.4, 0.66], [0.8, 0.62], [1.2, 0.66], [1.6, 0.62]]),
  street('Orchard Avenue', 'residential', [[0.02, 0.92], [0.5, 0.9], [1.0, 0.95], [1.6, 0.92]]),
  street('Russet Street', 'residential', [[0.05, 1.2], [0.6, 1.2], [1.1, 1.18], [1.6, 1.2]]),
  street('Blossom Way', 'residential', [[0.5, 0.47], [0.55, 0.8], [0.45, 1.05], [0.5, 1.3]]),
  street('Cider Lane', 'residential', [[0.95, 0.47], [1.0, 0.8], [0.95, 1.3]]),
];

/** The model's mean price (before noise and rounding) for a sale of `floorArea` ft² closed `months` before the effective date. */
export function modelPrice(neighbourhood: NeighbourhoodModel, floorArea: number, months: number): number {
  const { priceLevel, pricePerSqFt, monthlyTrend } = neighbourhood;
  return (priceLevel + pricePerSqFt * floorArea) * (1 + monthlyTrend) ** -months;
}

export function neighbourhoodBySlug(slug: string): NeighbourhoodModel {
  const found = NEIGHBOURHOODS.find((n) => n.slug === slug);
  if (!found) throw new RangeError(`unknown Port Ellery neighbourhood: ${slug}`);
  return found;
}

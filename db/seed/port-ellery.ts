import {
  along, bbox, bearing, booleanPointInPolygon, destination, lineString, nearestPointOnLine, point, pointToLineDistance, polygon,
} from '@turf/turf';
import type { Feature, LineString } from 'geojson';
import { createRandom, type Random } from './random';
import {
  AREA_UNIT, CURRENCY, DATA_SOURCES, DAYS_PER_MONTH, EFFECTIVE_DATE, NEIGHBOURHOODS, SALES_WINDOW_MONTHS, STREETS,
  modelPrice, neighbourhoodBySlug, type NeighbourhoodModel, type StreetModel,
} from './port-ellery-model';

/**
 * Generates the Port Ellery demo scenario from the model in port-ellery-model.ts: about 150 sales,
 * four planted anomalies in Quarry Hill, and the demo subject at 14 Lantern Lane. Pure and
 * deterministic: the same seed always gives the same scenario; nothing is read or written.
 */

export type SaleType = 'arms-length' | 'distressed' | 'family' | 'estate' | 'new-construction' | 'other';
export type AnomalyKind = 'family-transfer' | 'distressed-sale' | 'floor-area-typo' | 'tear-down';
export type NeighbourhoodSlug = NeighbourhoodModel['slug'];

export interface PortEllerySale {
  key: string;
  address: string;
  neighbourhood: NeighbourhoodSlug;
  lon: number;
  lat: number;
  salePrice: number;
  saleDate: string; // yyyy-mm-dd
  floorArea: number; // ft², as recorded: a planted typo stays as keyed
  lotSize: number; // ft²
  bedrooms: number;
  bathrooms: number; // half steps
  yearBuilt: number;
  condition: number; // 1 (new or as new) … 6 (not habitable as is), see port-ellery-model.ts
  quality: number; // 1 (finest) … 6 (minimal), see port-ellery-model.ts
  garageSpaces: number;
  saleType: SaleType;
  sellerConcessions: number;
  dataSource: string;
  verificationNote: string;
}

export interface PlantedAnomaly {
  saleKey: string;
  kind: AnomalyKind;
  description: string;
}

export type PortEllerySubject = Pick<
  PortEllerySale,
  'address' | 'neighbourhood' | 'lon' | 'lat' | 'floorArea' | 'lotSize' | 'bedrooms' | 'bathrooms' | 'yearBuilt' | 'condition' | 'quality' | 'garageSpaces'
>;

export interface PortElleryScenario {
  effectiveDate: string;
  currency: string;
  areaUnit: string;
  neighbourhoods: NeighbourhoodModel[];
  sales: PortEllerySale[];
  plantedAnomalies: PlantedAnomaly[];
  subject: PortEllerySubject;
  /** The subject of the demo's second assignment, the one already with the reviewer. */
  reviewSubject: PortEllerySubject;
}

type SaleDraft = Omit<PortEllerySale, 'key'> & { anomaly?: Omit<PlantedAnomaly, 'saleKey'>; drawOrder: number };

const SUBJECT_ADDRESS = '14 Lantern Lane';
const REVIEW_SUBJECT_ADDRESS = '9 Cobble Lane';
const METRES_PER_HOUSE_NUMBER_PAIR = 20;
const MAX_METRES_FROM_STREET = 60;
const MIN_METRES_FROM_STREET = 12;
const ARMS_LENGTH_NOTES = [
  "Confirmed with the buyer's agent; typical marketing time.",
  'Confirmed with the listing agent; no unusual terms.',
  'Deed and transfer record reviewed; confirmed with the seller.',
  'Confirmed with the buyer; listed on the open market.',
] as const;

const streetLines: ReadonlyArray<{ street: StreetModel; line: Feature<LineString> }> = STREETS.map((street) => ({
  street,
  line: lineString(street.path, { name: street.name }),
}));

const round = (value: number, step: number) => Math.round(value / step) * step;
const clamp = (value: number, low: number, high: number) => Math.min(high, Math.max(low, value));
const round6 = (value: number) => Math.round(value * 1e6) / 1e6;
const ft2 = (area: number) => `${area.toLocaleString('en-US')} ft²`;

/** House number from the distance along the street: odd numbers on the left, even on the right. */
function houseNumber(street: StreetModel, distanceAlong: number, segmentIndex: number, lon: number, lat: number): number {
  const segment = Math.min(segmentIndex, street.path.length - 2); // a snap to the last vertex reports its index
  const [ax, ay] = street.path[segment];
  const [bx, by] = street.path[segment + 1];
  const onLeft = (bx - ax) * (lat - ay) - (by - ay) * (lon - ax) > 0;
  const pair = Math.max(1, Math.ceil(distanceAlong / METRES_PER_HOUSE_NUMBER_PAIR));
  return onLeft ? 2 * pair - 1 : 2 * pair;
}

function nearestStreet(lon: number, lat: number) {
  const here = point([lon, lat]);
  let best = streetLines[0];
  let bestDistance = Infinity;
  for (const candidate of streetLines) {
    const distance = pointToLineDistance(here, candidate.line, { units: 'meters' });
    if (distance < bestDistance) [best, bestDistance] = [candidate, distance];
  }
  return { ...best, distance: bestDistance };
}

/** Rejection-samples a house site inside the neighbourhood and near a street, and gives it a free address. */
function placeHouse(rng: Random, neighbourhood: NeighbourhoodModel, usedAddresses: Set<string>) {
  const area = polygon([neighbourhood.polygon]);
  const [west, south, east, north] = bbox(area);
  for (let attempt = 0; attempt < 20_000; attempt++) {
    const lon = round6(rng.uniform(west, east));
    const lat = round6(rng.uniform(south, north));
    if (!booleanPointInPolygon(point([lon, lat]), area)) continue;
    const { street, line, distance } = nearestStreet(lon, lat);
    if (distance > MAX_METRES_FROM_STREET || distance < MIN_METRES_FROM_STREET) continue;
    const snapped = nearestPointOnLine(line, point([lon, lat]), { units: 'meters' });
    let number = houseNumber(street, snapped.properties.lineDistance, snapped.properties.segmentIndex, lon, lat);
    while (usedAddresses.has(`${number} ${street.name}`)) number += 2;
    const address = `${number} ${street.name}`;
    usedAddresses.add(address);
    return { lon, lat, address };
  }
  throw new Error(`could not place a house in ${neighbourhood.name}`);
}

const effectiveTime = Date.parse(`${EFFECTIVE_DATE}T00:00:00Z`);
const windowStart = new Date(effectiveTime);
windowStart.setUTCMonth(windowStart.getUTCMonth() - SALES_WINDOW_MONTHS);
const WINDOW_DAYS = Math.round((effectiveTime - windowStart.getTime()) / 86_400_000);

/** A sale date 1 … WINDOW_DAYS days before the effective date, and its age in months. */
function drawSaleDate(rng: Random) {
  const daysBefore = rng.integer(1, WINDOW_DAYS);
  const saleDate = new Date(effectiveTime - daysBefore * 86_400_000).toISOString().slice(0, 10);
  return { saleDate, months: daysBefore / DAYS_PER_MONTH };
}

function drawCharacteristics(rng: Random, n: NeighbourhoodModel, floorArea: number, saleYear: number) {
  const yearBuilt = Math.min(rng.integer(n.yearBuilt.from, n.yearBuilt.to), saleYear);
  const isNew = yearBuilt >= saleYear - 1 && yearBuilt >= 2025;
  const age = 2026 - yearBuilt;
  return {
    lotSize: round(n.lotSize.median * Math.exp(rng.normal(0, n.lotSize.logSd)), 50),
    bedrooms: clamp(Math.round(floorArea / 560 + rng.normal(0, 0.5)), 1, 6),
    bathrooms: clamp(round(floorArea / 850 + rng.normal(0, 0.35), 0.5), 1, 4.5),
    yearBuilt,
    condition: isNew ? 1 : clamp(Math.round(1.8 + age / 60 + rng.normal(0, 0.6)), 1, 5),
    quality: clamp(Math.round(n.typicalQuality + rng.normal(0, 0.55)), 1, 5),
    garageSpaces: rng.pick(n.garageSpaces),
    isNew,
  };
}

/** An ordinary sale: price from the model plus noise. */
function drawMarketSale(rng: Random, n: NeighbourhoodModel, used: Set<string>, drawOrder: number, trueArea?: number): SaleDraft {
  const floorArea = trueArea ?? round(clamp(rng.normal(n.floorArea.mean, n.floorArea.sd), 0.55 * n.floorArea.mean, 1.8 * n.floorArea.mean), 10);
  const { saleDate, months } = drawSaleDate(rng);
  const { isNew, ...characteristics } = drawCharacteristics(rng, n, floorArea, Number(saleDate.slice(0, 4)));
  const saleType: SaleType = isNew ? 'new-construction' : rng.chance(0.06) ? 'estate' : 'arms-length';
  const verificationNote =
    saleType === 'new-construction' ? "New build sold by the developer; confirmed with the developer's sales office."
    : saleType === 'estate' ? 'Estate sale; the executor confirmed it was listed on the open market.'
    : rng.pick(ARMS_LENGTH_NOTES);
  return {
    ...placeHouse(rng, n, used),
    neighbourhood: n.slug,
    salePrice: round(modelPrice(n, floorArea, months) + rng.normal(0, n.residualSd), 500),
    saleDate,
    floorArea,
    ...characteristics,
    saleType,
    sellerConcessions: saleType === 'arms-length' && rng.chance(0.15) ? rng.integer(4, 18) * 500 : 0,
    dataSource: rng.pick(DATA_SOURCES),
    verificationNote,
    drawOrder,
  };
}

/** The four planted anomalies, all in Quarry Hill, the subject's neighbourhood. */
function drawAnomalies(rng: Random, n: NeighbourhoodModel, used: Set<string>, first: number): SaleDraft[] {
  const shareOfMarket = (sale: SaleDraft, share: number) => {
    const months = (effectiveTime - Date.parse(`${sale.saleDate}T00:00:00Z`)) / 86_400_000 / DAYS_PER_MONTH;
    return round(share * modelPrice(n, sale.floorArea, months), 500);
  };
  const family = drawMarketSale(rng, n, used, first, 1_820);
  const distressed = drawMarketSale(rng, n, used, first + 1, 1_960);
  const typo = drawMarketSale(rng, n, used, first + 2, 1_640);
  const tearDown = drawMarketSale(rng, n, used, first + 3, 1_180);
  const keyedArea = typo.floorArea * 10;
  return [
    {
      ...family, salePrice: shareOfMarket(family, 0.6), saleType: 'family', sellerConcessions: 0,
      verificationNote: 'Transfer from parent to daughter; not offered on the open market.',
      anomaly: {
        kind: 'family-transfer',
        description: 'Sold between relatives at about 60% of market, without exposure to the open market.',
      },
    },
    {
      ...distressed, salePrice: shareOfMarket(distressed, 0.72), saleType: 'distressed', condition: 5, sellerConcessions: 0,
      verificationNote: 'Lender-owned after foreclosure; sold as is after two weeks on the market.',
      anomaly: {
        kind: 'distressed-sale',
        description: 'Foreclosure resale at about 28% below market: sold as is, short marketing time, motivated seller.',
      },
    },
    {
      ...typo, floorArea: keyedArea,
      anomaly: {
        kind: 'floor-area-typo',
        description: `Floor area keyed as ${ft2(keyedArea)}; the house has ${ft2(typo.floorArea)} (an extra zero). The price is normal for ${ft2(typo.floorArea)}.`,
      },
    },
    {
      ...tearDown, lotSize: 9_800, salePrice: 15 * 9_800, yearBuilt: 1911, condition: 6, quality: 5, garageSpaces: 0,
      saleType: 'other', sellerConcessions: 0, verificationNote: 'bought for land value, house demolished',
      anomaly: {
        kind: 'tear-down',
        description: 'A worn-out 1911 house bought for its land (about $15 per ft² of lot) and demolished; the price says nothing about floor area.',
      },
    },
  ];
}

/** A house site `metresBack` off a street, `metresAlong` it from its first vertex, on its right-hand
 * (even-numbered) or left-hand (odd-numbered) side. */
function siteOnStreet(streetName: string, metresAlong: number, side: 'left' | 'right', metresBack: number) {
  const street = streetLines.find(({ street: s }) => s.name === streetName)!;
  const front = along(street.line, metresAlong, { units: 'meters' });
  const ahead = along(street.line, metresAlong + 10, { units: 'meters' });
  const site = destination(front, metresBack, bearing(front, ahead) + (side === 'right' ? 90 : -90), { units: 'meters' });
  const [lon, lat] = site.geometry.coordinates;
  return { lon: round6(lon), lat: round6(lat) };
}

export function generatePortEllery(seed = 20261115): PortElleryScenario {
  const rng = createRandom(seed);
  const usedAddresses = new Set<string>([SUBJECT_ADDRESS, REVIEW_SUBJECT_ADDRESS]);
  const drafts: SaleDraft[] = [];
  for (const n of NEIGHBOURHOODS) {
    const anomalies = n.slug === 'quarry-hill' ? drawAnomalies(rng, n, usedAddresses, drafts.length) : [];
    drafts.push(...anomalies);
    for (let i = anomalies.length; i < n.salesCount; i++) drafts.push(drawMarketSale(rng, n, usedAddresses, drafts.length));
  }

  drafts.sort((a, b) => a.saleDate.localeCompare(b.saleDate) || a.drawOrder - b.drawOrder);
  const sales: PortEllerySale[] = [];
  const plantedAnomalies: PlantedAnomaly[] = [];
  drafts.forEach(({ anomaly, drawOrder: _drawOrder, ...sale }, index) => {
    const key = `PE-${String(index + 1).padStart(4, '0')}`;
    sales.push({ key, ...sale });
    if (anomaly) plantedAnomalies.push({ saleKey: key, ...anomaly });
  });

  const quarryHill = neighbourhoodBySlug('quarry-hill');
  return {
    effectiveDate: EFFECTIVE_DATE,
    currency: CURRENCY,
    areaUnit: AREA_UNIT,
    neighbourhoods: structuredClone(NEIGHBOURHOODS) as NeighbourhoodModel[],
    sales,
    plantedAnomalies,
    // 14 Lantern Lane: 130 m along the lane, 18 m back on its even (right-hand) side.
    subject: {
      address: SUBJECT_ADDRESS,
      neighbourhood: quarryHill.slug,
      ...siteOnStreet('Lantern Lane', 130, 'right', 18),
      floorArea: 1_850, lotSize: 7_250, bedrooms: 3, bathrooms: 2,
      yearBuilt: 1958, condition: 3, quality: 3, garageSpaces: 1,
    },
    // 9 Cobble Lane: 90 m along the lane, 16 m back on its odd (left-hand) side.
    reviewSubject: {
      address: REVIEW_SUBJECT_ADDRESS,
      neighbourhood: quarryHill.slug,
      ...siteOnStreet('Cobble Lane', 90, 'left', 16),
      floorArea: 1_720, lotSize: 6_800, bedrooms: 3, bathrooms: 2,
      yearBuilt: 1949, condition: 3, quality: 3, garageSpaces: 1,
    },
  };
}

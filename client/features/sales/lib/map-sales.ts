import { saleTypeLabels } from '@contracts/sales';
import { photoUrl } from '@contracts/photos';
import { formatIsoDate } from '../../../lib/format-date';
import type { CompRow } from './comp-rows';
import type { Figures } from './figures';
import type { ResidualBand } from './residual-band';

/** A sale in the shape the map draws (the map feature's MapSale, matched by structure). */
export interface SaleOnMap {
  id: number;
  lon: number;
  lat: number;
  band: ResidualBand;
  flagged: boolean;
  excluded: boolean;
  inGrid: boolean;
  title: string;
}

/** The located rows as map sales. Kept lean: the popup's figures are formatted on demand. */
export function salesOnMap(rows: readonly CompRow[]): SaleOnMap[] {
  const located: SaleOnMap[] = [];
  for (const { sale, band, flags } of rows) {
    if (sale.lon == null || sale.lat == null) continue;
    located.push({ id: sale.id, lon: sale.lon, lat: sale.lat, band, flagged: flags.length > 0, excluded: sale.excluded, inGrid: sale.inGrid, title: sale.address });
  }
  return located;
}

/** The popup of one sale (the map feature's SalePopup), in the assignment's currency and unit. */
export function salePopup({ sale, pricePerArea, distance, flagReason, monthsSinceSale }: CompRow, figures: Figures) {
  const facts: Array<readonly [string, string]> = [
    ['Price', figures.price(sale.salePrice)],
    ['Sold', formatIsoDate(sale.saleDate)],
    ['Before effective date', figures.months(monthsSinceSale)],
    ['Area', figures.area(sale.floorArea)],
    [`Per ${figures.areaSymbol}`, figures.pricePerArea(pricePerArea)],
  ];
  if (distance !== null) facts.push(['From subject', figures.distance(distance)]);
  return {
    subtitle: `${sale.neighbourhood ?? 'No neighbourhood'} · ${saleTypeLabels[sale.saleType]}${sale.inGrid ? ' · in the grid' : ''}`,
    facts,
    note: sale.excluded ? `Excluded: ${sale.exclusionReason ?? 'no reason given'}` : flagReason,
    thumbUrl: sale.coverPhotoId ? photoUrl(sale.coverPhotoId, 'thumb') : null,
  };
}

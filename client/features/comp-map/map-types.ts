/** The map's props and the shape of a sale on it. Kept apart from the map code so that pages can
 * use the types without pulling maplibre into their chunk. */
export interface LonLat {
  lon: number;
  lat: number;
}

/** Diverging residual bands, teal below the line → grey → rust above it; 'none' without a fit. */
export type MapResidualBand = 'none' | 'low-strong' | 'low' | 'low-soft' | 'mid' | 'high-soft' | 'high' | 'high-strong';

export interface MapSale {
  id: number;
  lon: number;
  lat: number;
  band: MapResidualBand;
  flagged: boolean;
  excluded: boolean;
  inGrid: boolean;
  /** The address: the marker's accessible name and the popup's title. */
  title: string;
}

/** What the popup of one sale shows; asked for only when the sale is opened (20,000 sales need
 * no 20,000 sets of formatted figures). */
export interface SalePopup {
  /** A line under the title (neighbourhood, sale type). */
  subtitle: string;
  /** Figures, already formatted in the assignment's currency and unit. */
  facts: ReadonlyArray<readonly [label: string, value: string]>;
  /** Why the sale is flagged or excluded, in words. */
  note: string | null;
  thumbUrl: string | null;
}

export interface CompMapProps {
  areaUnit: 'sqft' | 'sqm';
  subject: LonLat | null;
  sales: readonly MapSale[];
  selectedSaleId?: number | null;
  onSelectSale?: (saleId: number | null) => void;
  /** Click on empty map → a small popup offering "Add a sale here". */
  onAddSaleAt?: (at: LonLat) => void;
  /** Click on empty map sets a location at once (the subject step). */
  onPickLocation?: (at: LonLat) => void;
  /** Sale markers become draggable; the drop is reported here. */
  onMoveSale?: (saleId: number, at: LonLat) => void;
  onEditSale?: (saleId: number) => void;
  /** The popup's content for a sale; without it the popup shows the address only. */
  describeSale?: (saleId: number) => SalePopup | null;
  /** Accessible name of the map region. */
  label: string;
  className?: string;
}

/** Above this many sales the map draws them as clustered circles on the GPU instead of HTML markers. */
export const CLUSTER_ABOVE = 300;

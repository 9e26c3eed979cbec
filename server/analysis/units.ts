// Floor-area units. The international foot is exactly 0.3048 m (international yard and pound
// agreement, 1959), so a square foot is exactly 0.09290304 m².

export type AreaUnit = 'sqft' | 'sqm';

export const METRES_PER_FOOT = 0.3048;
export const SQUARE_METRES_PER_SQUARE_FOOT = METRES_PER_FOOT * METRES_PER_FOOT;

export function squareFeetToSquareMetres(squareFeet: number): number {
  return squareFeet * SQUARE_METRES_PER_SQUARE_FOOT;
}

export function squareMetresToSquareFeet(squareMetres: number): number {
  return squareMetres / SQUARE_METRES_PER_SQUARE_FOOT;
}

/** An area in `from` units expressed in `to` units. */
export function convertArea(area: number, from: AreaUnit, to: AreaUnit): number {
  if (from === to) return area;
  return from === 'sqft' ? squareFeetToSquareMetres(area) : squareMetresToSquareFeet(area);
}

/**
 * A rate per unit area (price per ft², say) expressed per `to` unit. A rate moves the opposite
 * way to an area: $100 per ft² is about $1,076 per m².
 */
export function convertRatePerArea(rate: number, from: AreaUnit, to: AreaUnit): number {
  if (from === to) return rate;
  return from === 'sqft' ? rate / SQUARE_METRES_PER_SQUARE_FOOT : rate * SQUARE_METRES_PER_SQUARE_FOOT;
}

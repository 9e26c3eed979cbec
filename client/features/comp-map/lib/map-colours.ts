import type { MapResidualBand } from '../map-types';

/**
 * The map paints with the app's own colour tokens (client/styles/app.css), read from the page at
 * start-up; the fallbacks are the same values, for a page without the stylesheet. Water and the
 * ground outside the town are mixed from the tokens rather than new colours.
 */
const tokenFallbacks = {
  paper: '#f7f3ea',
  'paper-raised': '#fffdf8',
  'paper-sunk': '#efe8da',
  rule: '#e0d7c6',
  'rule-strong': '#bfb199',
  ink: '#1d2a44',
  'ink-soft': '#47536c',
  'ink-faint': '#7b8293',
  teal: '#1d6a66',
  'teal-wash': '#dcebe6',
  'residual-low-strong': '#0f5a57',
  'residual-low': '#3f8984',
  'residual-low-soft': '#9cc3bd',
  'residual-mid': '#a7a59e',
  'residual-high-soft': '#e0ad92',
  'residual-high': '#c0683f',
  'residual-high-strong': '#92361a',
  'flag-ring': '#c2237f',
} as const;

export type ColourToken = keyof typeof tokenFallbacks;
export type MapColours = Record<ColourToken, string> & { water: string; shore: string; outside: string };

function hexToRgb(hex: string): [number, number, number] | null {
  const m = /^#([0-9a-f]{6})$/i.exec(hex.trim());
  if (!m) return null;
  const n = parseInt(m[1], 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/** `share` of colour a over colour b, as #rrggbb. */
export function mix(a: string, b: string, share: number): string {
  const ca = hexToRgb(a);
  const cb = hexToRgb(b);
  if (!ca || !cb) return a;
  const channel = (i: number) => Math.round(ca[i] * share + cb[i] * (1 - share)).toString(16).padStart(2, '0');
  return `#${channel(0)}${channel(1)}${channel(2)}`;
}

export function readMapColours(element: Element = document.documentElement): MapColours {
  const style = getComputedStyle(element);
  const colours = {} as Record<ColourToken, string>;
  for (const [token, fallback] of Object.entries(tokenFallbacks) as Array<[ColourToken, string]>) {
    const value = style.getPropertyValue(`--color-${token}`).trim();
    colours[token] = hexToRgb(value) ? value : fallback;
  }
  return {
    ...colours,
    water: mix(colours.teal, mix(colours.ink, colours['paper-raised'], 0.2), 0.16),
    shore: mix(colours.ink, colours['paper-raised'], 0.32),
    outside: mix(colours.ink, colours['paper-sunk'], 0.08),
  };
}

export function bandColour(colours: MapColours, band: MapResidualBand): string {
  return band === 'none' ? colours['ink-faint'] : colours[`residual-${band}`];
}

export const residualBands: readonly Exclude<MapResidualBand, 'none'>[] = ['low-strong', 'low', 'low-soft', 'mid', 'high-soft', 'high', 'high-strong'];

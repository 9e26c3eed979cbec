import type { MapSale, SalePopup } from '../map-types';

/**
 * The DOM of the map's HTML markers. Built by hand (maplibre positions plain elements), styled in
 * comp-map.css with the app's colour tokens, and written with textContent only: no HTML strings.
 */

export function saleMarkerElement(sale: MapSale): HTMLButtonElement {
  const button = document.createElement('button');
  button.type = 'button';
  button.className = 'cm-sale';
  const dot = document.createElement('span');
  dot.className = 'cm-sale-dot';
  dot.setAttribute('aria-hidden', 'true');
  button.append(dot);
  updateSaleMarker(button, sale, false);
  return button;
}

export function updateSaleMarker(element: HTMLElement, sale: MapSale, selected: boolean) {
  element.dataset.saleId = String(sale.id);
  element.dataset.band = sale.band;
  element.dataset.flagged = String(sale.flagged);
  element.dataset.excluded = String(sale.excluded);
  element.dataset.grid = String(sale.inGrid);
  element.dataset.selected = String(selected);
  const states = [sale.inGrid && 'in the grid', sale.flagged && 'flagged', sale.excluded && 'excluded'].filter(Boolean).join(', ');
  element.setAttribute('aria-label', `Sale: ${sale.title}${states ? ` (${states})` : ''}`);
  element.setAttribute('aria-pressed', String(selected));
}

/** The subject: an ink house shape, unlike any sale marker. */
export function subjectMarkerElement(): HTMLElement {
  const element = document.createElement('div');
  element.className = 'cm-subject';
  element.setAttribute('role', 'img');
  element.setAttribute('aria-label', 'Subject property');
  element.innerHTML =
    '<svg viewBox="0 0 30 32" width="30" height="32" aria-hidden="true">' +
    '<path d="M15 2.2 28 12.6V29.5H2V12.6Z" fill="var(--color-ink)" stroke="var(--color-paper-raised)" stroke-width="2.2" stroke-linejoin="round"/>' +
    '<rect x="11.4" y="17.6" width="7.2" height="8.6" rx="1" fill="var(--color-paper-raised)"/></svg>';
  return element;
}

/** A small text label that never catches the pointer (neighbourhood names, ring distances, cluster counts). */
export function labelElement(text: string, className: string): HTMLElement {
  const element = document.createElement('div');
  element.className = className;
  element.textContent = text;
  element.setAttribute('aria-hidden', 'true');
  return element;
}

export interface PopupActions {
  label: string;
  onChoose: () => void;
  primary?: boolean;
}

/** The popup of a sale: cover thumbnail, title, figures, the flag or exclusion note, actions. */
export function salePopupContent(sale: MapSale, details: SalePopup | null, actions: PopupActions[]): HTMLElement {
  const root = document.createElement('div');
  root.className = 'cm-popup';
  if (details?.thumbUrl) {
    const img = document.createElement('img');
    img.src = details.thumbUrl;
    img.alt = `Cover photo of ${sale.title}`;
    img.className = 'cm-popup-thumb';
    img.width = 240;
    img.height = 120;
    root.append(img);
  }
  const title = document.createElement('p');
  title.className = 'cm-popup-title';
  title.textContent = sale.title;
  const subtitle = document.createElement('p');
  subtitle.className = 'cm-popup-subtitle';
  subtitle.textContent = details?.subtitle ?? '';
  const facts = document.createElement('dl');
  facts.className = 'cm-popup-facts';
  for (const [label, value] of details?.facts ?? []) {
    const dt = document.createElement('dt');
    dt.textContent = label;
    const dd = document.createElement('dd');
    dd.textContent = value;
    facts.append(dt, dd);
  }
  root.append(title, subtitle, facts);
  if (details?.note) {
    const note = document.createElement('p');
    note.className = sale.excluded ? 'cm-popup-note cm-popup-note-excluded' : 'cm-popup-note';
    note.textContent = details.note;
    root.append(note);
  }
  appendActions(root, actions);
  return root;
}

/** The popup offered on a click of empty map. */
export function offerPopupContent(text: string, actions: PopupActions[]): HTMLElement {
  const root = document.createElement('div');
  root.className = 'cm-popup cm-popup-offer';
  const line = document.createElement('p');
  line.className = 'cm-popup-coords';
  line.textContent = text;
  root.append(line);
  appendActions(root, actions);
  return root;
}

function appendActions(root: HTMLElement, actions: PopupActions[]) {
  if (actions.length === 0) return;
  const row = document.createElement('div');
  row.className = 'cm-popup-actions';
  for (const action of actions) {
    const button = document.createElement('button');
    button.type = 'button';
    button.className = action.primary ? 'cm-button cm-button-primary' : 'cm-button';
    button.textContent = action.label;
    button.addEventListener('click', action.onChoose);
    row.append(button);
  }
  root.append(row);
}

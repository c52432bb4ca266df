// What a builds-list row shows for one build, worked out once per build and kept. A keystroke
// that brings back rows seen a moment ago (a letter taken back, a filter cleared) then only
// writes text into the row elements: no number formatting, no current-cell wording, no width
// bound per row per key.
import { fixed, MISSING } from '../format/number';
import { showQuantity } from '../format/units';
import { KIND_LABELS } from '../parts/part-fields';
import { formatRoute } from '../router/routes';
import { SHOP_OWN_WORDS } from '../state/catalog.svelte';
import type { UnitSystem } from '$core/units';
import type { BuildSummary } from './build-summary';
import { currentCell, type CurrentCell } from './current-column';
import type { ListFont } from './list-fonts';

/** The cells that may be too wide for their column. */
export type ClippedCell = 'name' | 'vehicle' | 'customer' | 'supply';

/** An upper bound on a text's drawn width in one of the list's fonts, px. */
export type WidthBound = (text: string, font: ListFont) => number;

export interface RowText {
  href: string;
  kind: string;
  customer: string;
  supply: string;
  /** "Vehicle (Kind)", the vehicle cell's whole text for its tooltip. */
  vehicleTitle: string;
  voltage: string;
  speed: string;
  current: CurrentCell;
  /** Upper bounds on the clippable cells' text widths, px; null while the fonts are not known. */
  widths: Readonly<Record<ClippedCell, number>> | null;
}

export function rowText(s: BuildSummary, units: UnitSystem, bound: WidthBound | null): RowText {
  const kind = KIND_LABELS[s.kind] ?? s.kind;
  const customer = s.customerId === null ? SHOP_OWN_WORDS : s.customerName;
  const supply = s.supplyLabels.length ? s.supplyLabels.join(' | ') : MISSING;
  return {
    href: formatRoute({ name: 'build', id: s.id }),
    kind,
    customer,
    supply,
    vehicleTitle: `${s.vehicleName} (${kind})`,
    voltage: s.supplyVoltageFullV === null ? MISSING : `${fixed(s.supplyVoltageFullV, 1)} V`,
    speed: showQuantity(s.theoreticalSpeedKmh, 'speedKmh', units, 1),
    current: currentCell(s),
    widths: bound && {
      name: bound(s.name, 'name'),
      vehicle: bound(`${s.vehicleName} `, 'body') + bound(kind, 'small'),
      customer: bound(customer, 'body'),
      supply: bound(supply, 'body'),
    },
  };
}

/**
 * Row texts kept per build summary (the list's summaries are replaced, not changed, when the
 * data changes) for one set of display settings: a new `setting` (units, number locale, fonts)
 * starts afresh.
 */
export class RowTexts {
  #setting = '';
  #kept = new WeakMap<BuildSummary, RowText>();

  of(s: BuildSummary, units: UnitSystem, locale: string, bound: WidthBound | null, fontKey: string): RowText {
    const setting = `${units}|${locale}|${bound ? fontKey : ''}`;
    if (setting !== this.#setting) {
      this.#setting = setting;
      this.#kept = new WeakMap();
    }
    let text = this.#kept.get(s);
    if (!text) {
      text = rowText(s, units, bound);
      this.#kept.set(s, text);
    }
    return text;
  }
}

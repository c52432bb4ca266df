import { numberForInput } from '$core/number-text';
import { numberLocale } from './number-locale.svelte';

// Numbers as the screens show them: a fixed count of decimals per figure, a thin space before
// units, and an en dash where a figure is missing. Marks follow the number locale (the
// setting, else the system's), the same marks the forms read typed numbers with.

export const MISSING = '–';

// One formatter per locale and decimal count: building an Intl formatter per call costs more
// than the rest of a list row's update.
const FORMATTERS = new Map<string, Intl.NumberFormat>();

export function fixed(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING;
  const locale = numberLocale.tag;
  const key = `${locale}|${decimals}`;
  let f = FORMATTERS.get(key);
  if (!f) {
    try {
      f = new Intl.NumberFormat(locale, { minimumFractionDigits: decimals, maximumFractionDigits: decimals, numberingSystem: 'latn' });
    } catch {
      f = new Intl.NumberFormat('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
    }
    FORMATTERS.set(key, f);
  }
  return f.format(value);
}

/** Three significant figures for small values, whole numbers from 100 up (with thousands separators). */
export function smart(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING;
  const a = Math.abs(value);
  if (a >= 100) return fixed(value, 0);
  if (a >= 10) return fixed(value, 1);
  if (a >= 1) return fixed(value, 2);
  if (a === 0) return '0';
  return String(Number(value.toPrecision(3)));
}

export function percent(ratio: number | null | undefined, decimals = 0): string {
  if (ratio === null || ratio === undefined || !Number.isFinite(ratio)) return MISSING;
  return `${fixed(ratio * 100, decimals)} %`;
}

/**
 * Up to six significant digits without float noise, for a value put back into an input, in
 * the locale's marks and written so that it reads back as itself.
 */
export function editable(value: number, significant = 6): string {
  return numberForInput(Number(value.toPrecision(significant)), numberLocale.marks);
}

/** A value rounded for people to put in an input: `decimals` places at most, no float noise. */
export function editableRounded(value: number, decimals: number): string {
  return numberForInput(Number(value.toFixed(decimals)), numberLocale.marks);
}

/** Significant digits of the figures in `check` text output (the table a person reads). */
export const TEXT_SIGNIFICANT_DIGITS = 4;
/** Significant digits of figures, values, limits and margins in `--json` output; the store keeps full precision. */
export const JSON_SIGNIFICANT_DIGITS = 6;

/**
 * A figure to a number of significant digits, as a plain number: no float noise such as
 * 11.100000000000001 (which is 3 × 3.7 in binary floating point).
 */
export function roundSignificant(x: number, digits: number): number {
  if (!Number.isFinite(x) || x === 0) return x;
  return Number(x.toPrecision(digits));
}

/** A figure as a person reads it: four significant digits, whole numbers from 1000 up, no trailing zeros. */
export function formatNumber(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '–';
  if (Math.abs(x) >= 1000) return String(Math.round(x));
  if (x === 0) return '0';
  return String(roundSignificant(x, TEXT_SIGNIFICANT_DIGITS));
}

export function formatPercent(margin: number | null | undefined): string {
  if (margin === null || margin === undefined || !Number.isFinite(margin)) return '–';
  return `${(margin * 100).toFixed(1)} %`;
}

/** A figure as a person reads it: four significant digits, whole numbers from 1000 up, no trailing zeros. */
export function formatNumber(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '–';
  if (Math.abs(x) >= 1000) return String(Math.round(x));
  if (x === 0) return '0';
  return String(Number(x.toPrecision(4)));
}

export function formatPercent(margin: number | null | undefined): string {
  if (margin === null || margin === undefined || !Number.isFinite(margin)) return '–';
  return `${(margin * 100).toFixed(1)} %`;
}

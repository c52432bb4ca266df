/** A number as a message shows it: three significant figures, whole numbers from 100 up. */
export function messageNumber(n: number): string {
  // Plain arithmetic rounding: toPrecision is costly and this runs for every finding.
  const a = Math.abs(n);
  if (!Number.isFinite(n)) return String(n);
  if (a >= 100) return String(Math.round(n));
  if (a >= 10) return String(Math.round(n * 10) / 10);
  if (a >= 1) return String(Math.round(n * 100) / 100);
  return String(Number(n.toPrecision(3)));
}

/** A margin as whole percent. */
export function messagePercent(margin: number): string {
  return `${Math.round(margin * 100)} %`;
}

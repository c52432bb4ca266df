/** Fields whose value differs, for a history line a person can read at a glance. */
export function changedFields(before: Record<string, unknown>, after: Record<string, unknown>): string[] {
  const skip = new Set(['version', 'updatedAt', 'createdAt']);
  const out: string[] = [];
  for (const key of Object.keys(after)) {
    if (skip.has(key)) continue;
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) out.push(key);
  }
  return out;
}

export function describeChange(before: Record<string, unknown>, after: Record<string, unknown>): string {
  const fields = changedFields(before, after);
  if (fields.length === 0) return 'no field changed';
  return fields
    .map((f) => {
      const b = before[f];
      const a = after[f];
      const simple = (x: unknown) => x === null || ['string', 'number', 'boolean'].includes(typeof x);
      return simple(b) && simple(a) ? `${f} ${JSON.stringify(b)} → ${JSON.stringify(a)}` : f;
    })
    .join('; ');
}

/** Fields whose value differs, for a history line a person can read at a glance. */
export function changedFields(before: object, after: object): string[] {
  const skip = new Set(['version', 'updatedAt', 'createdAt']);
  const old = new Map(Object.entries(before));
  const out: string[] = [];
  for (const [key, value] of Object.entries(after)) {
    if (skip.has(key)) continue;
    if (JSON.stringify(old.get(key)) !== JSON.stringify(value)) out.push(key);
  }
  return out;
}

/** Any record's fields read by name: records are plain objects of their catalogue's fields. */
export function describeChange(before: object, after: object): string {
  const fields = changedFields(before, after);
  if (fields.length === 0) return 'no field changed';
  const old = new Map(Object.entries(before));
  const now = new Map(Object.entries(after));
  return fields
    .map((f) => {
      const b = old.get(f);
      const a = now.get(f);
      const simple = (x: unknown) => x === null || ['string', 'number', 'boolean'].includes(typeof x);
      return simple(b) && simple(a) ? `${f} ${JSON.stringify(b)} → ${JSON.stringify(a)}` : f;
    })
    .join('; ');
}

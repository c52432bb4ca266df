// A value that is either known or lacks named inputs. Figures and findings carry the names of
// the inputs they lack so that an incomplete verdict can say exactly what to fill in.

export type Known<T = number> = { readonly value: T; readonly missing: null } | { readonly value: null; readonly missing: readonly string[] };

export function known<T>(value: T): Known<T> {
  return { value, missing: null };
}

export function lacking<T = number>(...fields: string[]): Known<T> {
  return { value: null, missing: fields };
}

/** Every name missing among the given values, without repeats, in order of first appearance. */
export function missingOf(...values: readonly Known<unknown>[]): string[] {
  const out: string[] = [];
  for (const v of values) {
    if (v.missing === null) continue;
    for (const name of v.missing) if (!out.includes(name)) out.push(name);
  }
  return out;
}

const usable = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** A strictly positive finite number, else lacking the field. */
export function positive(x: number | null | undefined, field: string): Known {
  return usable(x) && x > 0 ? known(x) : lacking(field);
}

/** A finite number ≥ 0, else lacking the field. */
export function nonNegative(x: number | null | undefined, field: string): Known {
  return usable(x) && x >= 0 ? known(x) : lacking(field);
}

/** A whole number ≥ 1, else lacking the field. */
export function count(x: number | null | undefined, field: string): Known {
  return usable(x) && Number.isInteger(x) && x >= 1 ? known(x) : lacking(field);
}

import * as v from 'valibot';

/** One thing wrong with a file, and where: `builds[3].supplies[0].batteryIds[1]`, or `row 4, column "kv"` in a CSV. */
export interface FleetProblem {
  place: string;
  message: string;
}

export function problemLine(p: FleetProblem): string {
  return p.place === '' ? p.message : `${p.place}: ${p.message}`;
}

const PLAIN_KEY = /^[A-Za-z_$][A-Za-z0-9_$]*$/;

/** Appends a path segment: `[3]` for a list position, `.name` for a field, `["odd key"]` for a key that is not a plain name. */
export function placeOf(prefix: string, ...keys: readonly (string | number)[]): string {
  let out = prefix;
  for (const key of keys) {
    if (typeof key === 'number') out += `[${key}]`;
    else if (!PLAIN_KEY.test(key)) out += `[${JSON.stringify(key)}]`;
    else out += out === '' ? key : `.${key}`;
  }
  return out;
}

/**
 * A valibot issue as a problem a person can act on. A missing field is reported by the object
 * schema with the object's own message, so it is re-worded here as "is required".
 */
export function issueProblem(prefix: string, issue: v.BaseIssue<unknown>): FleetProblem {
  const keys = (issue.path ?? []).map((item) => item.key as string | number);
  const place = placeOf(prefix, ...keys);
  const objectType = issue.type === 'object' || issue.type === 'strict_object' || issue.type === 'loose_object';
  const missing = objectType && issue.expected !== 'never' && issue.received === 'undefined' && keys.length > 0;
  return { place, message: missing ? 'is required' : issue.message };
}

/** Every problem of one value against a schema, one per field (the first check that fails). */
export function schemaProblems<S extends v.GenericSchema>(schema: S, value: unknown, prefix: string, knownKeys?: ReadonlySet<string>): { ok: true; output: v.InferOutput<S> } | { ok: false; problems: FleetProblem[] } {
  const result = v.safeParse(schema, value, { abortPipeEarly: true });
  if (result.success) return { ok: true, output: result.output };
  let problems = result.issues.map((issue) => issueProblem(prefix, issue));
  if (knownKeys && typeof value === 'object' && value !== null && !Array.isArray(value)) {
    // The schema stops at the first field it does not know; a file may have several.
    const unknown = Object.keys(value).filter((k) => !knownKeys.has(k));
    if (unknown.length > 1) {
      const first = placeOf(prefix, unknown[0]!);
      problems = problems.filter((p) => p.place !== first);
      for (const key of unknown) problems.push({ place: placeOf(prefix, key), message: 'is not a field Rigbook knows' });
    }
  }
  return { ok: false, problems };
}

const LEADING = /^([A-Za-z]+)\[(\d+)\]/;

/** Problems in file order: kind by kind, record by record; whole-file problems first. */
export function sortProblems(problems: readonly FleetProblem[], kindOrder: readonly string[]): FleetProblem[] {
  const key = (p: FleetProblem): [number, number] => {
    const m = LEADING.exec(p.place);
    if (!m) return [-1, 0];
    return [kindOrder.indexOf(m[1] ?? ''), Number(m[2])];
  };
  return problems
    .map((p, i) => ({ p, i, k: key(p) }))
    .sort((a, b) => a.k[0] - b.k[0] || a.k[1] - b.k[1] || a.i - b.i)
    .map((x) => x.p);
}

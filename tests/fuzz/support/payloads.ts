import fc from 'fast-check';
import { boundaryValues, boundsOf, schemaAt, type SchemaNode } from './schema-walk';

// What the fuzz sends: payloads that are wrong in every way a buggy client, a hand-edited
// request or a hostile page could make them, and valid payloads bent one field at a time so
// the calls get past validation and into the handlers.

export const PROTO_KEYS = ['__proto__', 'constructor', 'prototype'] as const;
const ODD_KEYS = [...PROTO_KEYS, 'toString', 'valueOf', 'toJSON', 'hasOwnProperty', 'then', '', ' ', 'id ', 'colour'];

/** An own property even for `__proto__`, the way JSON.parse and structured clone deliver it. */
export function ownKey(target: Record<string, unknown>, key: string, value: unknown): void {
  Object.defineProperty(target, key, { value, enumerable: true, writable: true, configurable: true });
}

export const POLLUTION_MARK = 'rigbookPolluted';

/** Payloads that would pollute Object.prototype if any layer merged them naively. */
export function pollutingObjects(): unknown[] {
  return [
    JSON.parse(`{"__proto__":{"${POLLUTION_MARK}":"yes"}}`) as unknown,
    JSON.parse(`{"constructor":{"prototype":{"${POLLUTION_MARK}":"yes"}}}`) as unknown,
    JSON.parse(`{"prototype":{"${POLLUTION_MARK}":"yes"}}`) as unknown,
    JSON.parse(`{"changes":{"__proto__":{"${POLLUTION_MARK}":"yes"}},"id":"x","expectedVersion":1}`) as unknown,
    Object.create(null) as unknown,
  ];
}

const NASTY_NUMBERS = [
  0,
  -0,
  1,
  -1,
  0.5,
  Number.NaN,
  Number.POSITIVE_INFINITY,
  Number.NEGATIVE_INFINITY,
  Number.MAX_VALUE,
  -Number.MAX_VALUE,
  Number.MIN_VALUE,
  Number.MAX_SAFE_INTEGER,
  Number.MAX_SAFE_INTEGER + 2,
  Number.MIN_SAFE_INTEGER,
  2 ** 31,
  -(2 ** 31),
  2 ** 32,
  1e21,
  1e-300,
  -1e-300,
];

const NASTY_STRINGS = [
  '',
  ' ',
  '\u0000',
  '\n',
  'x'.repeat(65),
  'x'.repeat(121),
  'x'.repeat(501),
  'x'.repeat(4001),
  'x'.repeat(200_000),
  '__proto__',
  'constructor',
  'prototype',
  '../../etc/passwd',
  '..\\..\\boot.ini',
  '%00',
  '<script>alert(1)</script>',
  "'; drop table builds; --",
  '=cmd|calc',
  '\uD800',
  '\u202Eevil',
  '🔋🔋🔋',
  'NaN',
  '1e999',
  'null',
  'true',
  '[]',
  '{}',
  'pack-1',
  'build-1',
  'class-x',
];

function nest(depth: number, leaf: unknown, asArray: boolean): unknown {
  let out = leaf;
  for (let i = 0; i < depth; i++) out = asArray ? [out] : { a: out };
  return out;
}

const anythingSettings = {
  key: fc.oneof(fc.string({ maxLength: 8 }), fc.constantFrom(...ODD_KEYS)),
  maxDepth: 4,
  maxKeys: 6,
  withNullPrototype: true,
  withObjectString: true,
  withBoxedValues: true,
  withBigInt: true,
  withDate: true,
  withMap: true,
  withSet: true,
  withTypedArray: true,
  withSparseArray: true,
};

export const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(...NASTY_NUMBERS),
  fc.constantFrom(...NASTY_STRINGS),
  fc.constantFrom(null, undefined, true, false),
  fc.double(),
  fc.integer({ min: Number.MIN_SAFE_INTEGER, max: Number.MAX_SAFE_INTEGER }),
  fc.string({ maxLength: 80 }),
  fc.array(fc.anything(anythingSettings), { maxLength: 4 }),
  fc.tuple(fc.integer({ min: 20, max: 3000 }), fc.constantFrom<unknown>(1, 'x', null), fc.boolean()).map(([d, leaf, asArray]) => nest(d, leaf, asArray)),
  fc.constant(null).map(() => pollutingObjects()[0]),
  fc.anything(anythingSettings),
);

/** An object whose keys come from the schema (and a few traps), every value a nasty one. */
function objectOf(keys: readonly string[]): fc.Arbitrary<Record<string, unknown>> {
  return fc.array(fc.tuple(fc.constantFrom(...keys, ...ODD_KEYS), nastyValue), { maxLength: 7 }).map((pairs) => {
    const out: Record<string, unknown> = {};
    for (const [k, v] of pairs) ownKey(out, k, v);
    return out;
  });
}

/** Anything at all, shaped a little by the handler's field names so some of it reaches past the first check. */
export function malformedPayload(fields: readonly string[]): fc.Arbitrary<unknown> {
  const keyed = fields.length > 0 ? objectOf(fields) : objectOf(['x']);
  return fc.oneof(
    { weight: 3, arbitrary: fc.anything(anythingSettings) },
    { weight: 2, arbitrary: nastyValue },
    { weight: 4, arbitrary: keyed },
    { weight: 1, arbitrary: fc.array(keyed, { maxLength: 3 }) },
    { weight: 1, arbitrary: fc.constantFrom(...pollutingObjects()) },
    { weight: 1, arbitrary: keyed.map((o) => nest(40, o, false)) },
  );
}

type Path = (string | number)[];

/** Plain objects and arrays only: the shapes JSON and a structured clone deliver, and the ones worth bending. */
function isPlain(value: unknown): value is Record<string | number, unknown> {
  if (value === null || typeof value !== 'object') return false;
  const proto: unknown = Object.getPrototypeOf(value);
  return Array.isArray(value) ? proto === Array.prototype : proto === Object.prototype || proto === null;
}

function pathsOf(value: unknown, prefix: Path = [], out: Path[] = []): Path[] {
  if (!isPlain(value) || prefix.length > 30) return out;
  const keys: (string | number)[] = Array.isArray(value) ? Array.from({ length: Math.min(value.length, 20) }, (_, i) => i) : Object.keys(value).slice(0, 40);
  for (const key of keys) {
    const p = [...prefix, key];
    out.push(p);
    pathsOf(value[key], p, out);
  }
  return out;
}

function setAt(root: unknown, path: Path, value: unknown, remove: boolean): void {
  let node = root as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  const last = path[path.length - 1]!;
  if (remove && !Array.isArray(node)) delete node[last];
  else if (typeof last === 'string') ownKey(node as Record<string, unknown>, last, value);
  else node[last] = value;
}

export type Gen = fc.GeneratorValue;

export function pick<T>(g: Gen, items: readonly T[]): T {
  return items[g(fc.nat, { max: items.length - 1 })] as T;
}

/**
 * Bends a valid payload: each step takes one field (at any depth) and puts a value on or just
 * past its bound, a nasty value, another record's id, nothing at all, or an unknown sibling.
 */
export function mutate(g: Gen, payload: unknown, schema: SchemaNode, ids: readonly string[]): unknown {
  const steps = pick(g, [0, 0, 1, 1, 1, 2, 3]);
  const out = structuredClone(payload);
  for (let i = 0; i < steps; i++) {
    const paths = pathsOf(out);
    if (paths.length === 0) break;
    const path = pick(g, paths);
    const node = schemaAt(schema, path);
    const how = pick(g, ['bound', 'bound', 'bound', 'nasty', 'id', 'remove', 'sibling']);
    if (how === 'bound') setAt(out, path, pick(g, node ? boundaryValues(boundsOf(node)) : [null]), false);
    else if (how === 'nasty')
      setAt(
        out,
        path,
        g(() => nastyValue),
        false,
      );
    else if (how === 'id') setAt(out, path, pick(g, [...ids, 'no-such-id', 'pack-0']), false);
    else if (how === 'remove') setAt(out, path, undefined, true);
    else {
      const parent = path.slice(0, -1);
      if (Array.isArray(parent.reduce<unknown>((node, key) => (node as Record<string | number, unknown>)[key], out))) continue;
      const key = pick(g, ODD_KEYS);
      setAt(out, [...parent, key], pick(g, [1, 'x', { [POLLUTION_MARK]: 'yes' }, null]), false);
    }
  }
  return out;
}

const ABSOLUTE = /^(\/|\\\\|[A-Za-z]:[\\/])/;

/**
 * Re-roots every absolute path in a payload under the fuzz folder: a handler that writes a
 * file where it is told (a backup) must be fuzzed without writing anywhere else on the
 * machine. Relative paths are refused by such handlers, so they are left as generated.
 */
export function confinePaths(payload: unknown, sandbox: string): unknown {
  const confine = (s: string) => (ABSOLUTE.test(s) ? `${sandbox}/${s.replace(/[^A-Za-z0-9._-]/g, '_').slice(0, 80)}` : s);
  if (typeof payload === 'string') return confine(payload);
  const stack: unknown[] = [payload];
  const seen = new Set<unknown>();
  while (stack.length > 0) {
    const node = stack.pop();
    if (node === null || typeof node !== 'object' || seen.has(node)) continue;
    seen.add(node);
    if (!Array.isArray(node) && Object.getPrototypeOf(node) !== Object.prototype && Object.getPrototypeOf(node) !== null) continue;
    const record = node as Record<string, unknown>;
    for (const key of Object.keys(record)) {
      const value = record[key];
      if (typeof value === 'string') record[key] = confine(value);
      else stack.push(value);
    }
  }
  return payload;
}

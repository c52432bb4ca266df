// Reads a handler's valibot input schema as data, so the fuzz knows each field's name and
// bounds without a second list that could drift from the schemas: when a field is added to a
// schema, the fuzz starts probing it the same day.

export interface SchemaNode {
  type: string;
  entries?: Record<string, SchemaNode>;
  wrapped?: SchemaNode;
  options?: readonly unknown[];
  item?: SchemaNode;
  pipe?: ReadonlyArray<{ type: string; requirement?: unknown }>;
}

export interface Bounds {
  base: string;
  optional: boolean;
  nullable: boolean;
  min?: number;
  max?: number;
  above?: number;
  integer?: boolean;
  minLength?: number;
  maxLength?: number;
  options?: string[];
}

const WRAPPERS = new Set(['optional', 'nullable', 'nullish', 'exact_optional', 'undefinedable']);

/** The schema reached at a path (object keys and array positions), looking through optional, nullable and unions. */
export function schemaAt(schema: SchemaNode, path: readonly (string | number)[]): SchemaNode | null {
  let nodes: SchemaNode[] = [schema];
  for (const key of path) {
    const next: SchemaNode[] = [];
    for (const node of nodes.flatMap(unwrapAll)) {
      if (node.entries && typeof key === 'string' && Object.hasOwn(node.entries, key)) next.push(node.entries[key]!);
      if (node.item && typeof key === 'number') next.push(node.item);
    }
    if (next.length === 0) return null;
    nodes = next;
  }
  return nodes[0] ?? null;
}

/** The node and the alternatives a union offers, without optional/nullable wrappers. */
function unwrapAll(node: SchemaNode): SchemaNode[] {
  if (WRAPPERS.has(node.type) && node.wrapped) return unwrapAll(node.wrapped);
  if (node.type === 'union' && node.options) return (node.options as SchemaNode[]).flatMap(unwrapAll);
  return [node];
}

/** Every field name an object schema (or any option of a union) knows, at the top level. */
export function fieldNames(schema: SchemaNode): string[] {
  return [...new Set(unwrapAll(schema).flatMap((n) => Object.keys(n.entries ?? {})))];
}

export function boundsOf(schema: SchemaNode): Bounds {
  let node = schema;
  let optional = false;
  let nullable = false;
  while (WRAPPERS.has(node.type) && node.wrapped) {
    if (node.type !== 'nullable') optional = true;
    if (node.type !== 'optional' && node.type !== 'exact_optional' && node.type !== 'undefinedable') nullable = true;
    node = node.wrapped;
  }
  const out: Bounds = { base: node.type, optional, nullable };
  if (node.type === 'picklist') out.options = (node.options ?? []).map(String);
  for (const action of node.pipe ?? []) {
    const r = action.requirement;
    if (action.type === 'min_value' && typeof r === 'number') out.min = r;
    else if (action.type === 'max_value' && typeof r === 'number') out.max = r;
    else if (action.type === 'gt_value' && typeof r === 'number') out.above = r;
    else if (action.type === 'integer') out.integer = true;
    else if (action.type === 'min_length' && typeof r === 'number') out.minLength = r;
    else if (action.type === 'max_length' && typeof r === 'number') out.maxLength = r;
  }
  return out;
}

/** The next representable double above x (IEEE 754 binary64), for values just past a bound. */
export function nextUp(x: number): number {
  if (Number.isNaN(x) || x === Number.POSITIVE_INFINITY) return x;
  if (x === 0) return Number.MIN_VALUE;
  const buffer = new Float64Array([x]);
  const bits = new BigInt64Array(buffer.buffer);
  bits[0] = bits[0]! + (x > 0 ? 1n : -1n);
  return buffer[0]!;
}

export const nextDown = (x: number): number => -nextUp(-x);

/** Values on and just past every bound the schema states, plus the usual suspects for its type. */
export function boundaryValues(bounds: Bounds): unknown[] {
  const out: unknown[] = [];
  if (bounds.nullable) out.push(null);
  if (bounds.base === 'number') {
    const { min, max, above } = bounds;
    if (min !== undefined) out.push(min, nextDown(min), min - 1);
    if (max !== undefined) out.push(max, nextUp(max), max + 1, max * 10);
    if (above !== undefined) out.push(above, nextUp(above), -0);
    if (bounds.integer) out.push((min ?? 0) + 0.5, (max ?? 1) - 0.5);
    out.push(0, -0, 1, -1, Number.MIN_VALUE, 1e-300, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, Number.MAX_SAFE_INTEGER + 2, String(max ?? 1));
  } else if (bounds.base === 'string') {
    // Limits of file-sized fields (hundreds of megabytes) are probed elsewhere; here they would only exhaust memory.
    const max = bounds.maxLength ?? 64;
    const long = max <= 100_000 ? ['a'.repeat(max), 'a'.repeat(max + 1), '🔋'.repeat(Math.ceil(max / 2))] : ['a'.repeat(100_000)];
    out.push('', ' ', '  spaced  ', ...long, '\u0000', '\uD800', 42);
  } else if (bounds.base === 'picklist') {
    for (const o of bounds.options ?? []) out.push(o, o.toUpperCase(), ` ${o}`);
    out.push('', 0);
  } else if (bounds.base === 'boolean') {
    out.push(true, false, 0, 1, 'true', null);
  } else if (bounds.base === 'array') {
    out.push([], {}, 'a', [null]);
  } else {
    out.push(null, [], 'a', 0);
  }
  return out;
}

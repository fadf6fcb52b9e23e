/**
 * A small JSON Schema (draft-07) checker, for checking charts against the Vega-Lite schema that ships
 * with vega-lite (node_modules/vega-lite/build/vega-lite-schema.json). No validator package is
 * installed, so this covers exactly the keywords that schema uses: $ref (local "#/definitions/…"),
 * type, anyOf, properties, additionalProperties, required, items, minimum, maximum, const, enum,
 * minItems, maxItems, minProperties, minLength, maxLength. `format` and `description` are
 * annotations in draft-07 and are not checked. Any other keyword is reported, so a schema that needs
 * more than this checker knows cannot pass silently.
 */
type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type Schema = boolean | { [keyword: string]: unknown };

const KNOWN = new Set([
  '$ref', '$schema', 'definitions', 'description', 'type', 'anyOf', 'properties', 'additionalProperties', 'required',
  'items', 'minimum', 'maximum', 'const', 'enum', 'minItems', 'maxItems', 'minProperties', 'minLength', 'maxLength',
  'format', 'default', 'examples', 'title',
]);

function typeOf(v: Json): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'array';
  return typeof v;
}

function hasType(v: Json, t: string): boolean {
  if (t === 'integer') return typeof v === 'number' && Number.isInteger(v);
  return typeOf(v) === t;
}

/** How deep into the value the deepest error of an alternative lies (its path length). */
function reach(errors: readonly string[]): number {
  let depth = 0;
  for (const e of errors) for (const m of e.matchAll(/\$[^:\s]*/g)) depth = Math.max(depth, (m[0].match(/[.[]/g) ?? []).length);
  return depth;
}

function deepEqual(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

export function schemaErrors(root: Schema, value: unknown): string[] {
  const errors: string[] = [];
  const resolve = (ref: string): Schema => {
    if (!ref.startsWith('#/')) throw new Error(`only local references are supported: ${ref}`);
    let node: unknown = root;
    for (const part of ref.slice(2).split('/')) node = (node as Record<string, unknown>)[decodeURIComponent(part)];
    if (node === undefined) throw new Error(`unresolved reference ${ref}`);
    return node as Schema;
  };
  const check = (schema: Schema, v: Json, path: string, out: string[]): void => {
    if (schema === true) return;
    if (schema === false) {
      out.push(`${path}: not allowed`);
      return;
    }
    for (const key of Object.keys(schema)) if (!KNOWN.has(key)) out.push(`${path}: checker does not know keyword ${key}`);
    if (typeof schema.$ref === 'string') check(resolve(schema.$ref), v, path, out);
    if (schema.type !== undefined) {
      const types = Array.isArray(schema.type) ? (schema.type as string[]) : [schema.type as string];
      if (!types.some((t) => hasType(v, t))) {
        out.push(`${path}: expected ${types.join(' or ')}, found ${typeOf(v)}`);
        return;
      }
    }
    if (schema.const !== undefined && !deepEqual(schema.const, v)) out.push(`${path}: expected ${JSON.stringify(schema.const)}`);
    if (Array.isArray(schema.enum) && !schema.enum.some((e) => deepEqual(e, v))) {
      out.push(`${path}: ${JSON.stringify(v)} is not one of ${JSON.stringify(schema.enum)}`);
    }
    if (Array.isArray(schema.anyOf)) {
      const tries = (schema.anyOf as Schema[]).map((s) => {
        const e: string[] = [];
        check(s, v, path, e);
        return e;
      });
      if (!tries.some((e) => e.length === 0)) {
        // The alternative that got deepest into the value before failing explains the failure best.
        const best = tries.reduce((a, b) => (reach(b) > reach(a) || (reach(b) === reach(a) && b.length < a.length) ? b : a));
        out.push(`${path}: matches no alternative (closest: ${best.slice(0, 3).join('; ')})`);
      }
    }
    if (typeof v === 'number') {
      if (typeof schema.minimum === 'number' && v < schema.minimum) out.push(`${path}: ${v} < ${schema.minimum}`);
      if (typeof schema.maximum === 'number' && v > schema.maximum) out.push(`${path}: ${v} > ${schema.maximum}`);
    }
    if (typeof v === 'string') {
      if (typeof schema.minLength === 'number' && v.length < schema.minLength) out.push(`${path}: string too short`);
      if (typeof schema.maxLength === 'number' && v.length > schema.maxLength) out.push(`${path}: string too long`);
    }
    if (Array.isArray(v)) {
      if (typeof schema.minItems === 'number' && v.length < schema.minItems) out.push(`${path}: fewer than ${schema.minItems} items`);
      if (typeof schema.maxItems === 'number' && v.length > schema.maxItems) out.push(`${path}: more than ${schema.maxItems} items`);
      if (Array.isArray(schema.items)) {
        (schema.items as Schema[]).forEach((s, i) => {
          if (i < v.length) check(s, v[i]!, `${path}[${i}]`, out);
        });
      } else if (schema.items !== undefined) {
        v.forEach((item, i) => check(schema.items as Schema, item, `${path}[${i}]`, out));
      }
    }
    if (v !== null && typeof v === 'object' && !Array.isArray(v)) {
      const props = (schema.properties ?? {}) as Record<string, Schema>;
      for (const r of (schema.required ?? []) as string[]) if (!(r in v)) out.push(`${path}: missing ${r}`);
      if (typeof schema.minProperties === 'number' && Object.keys(v).length < schema.minProperties) {
        out.push(`${path}: fewer than ${schema.minProperties} properties`);
      }
      for (const [k, item] of Object.entries(v)) {
        if (k in props) check(props[k]!, item, `${path}.${k}`, out);
        else if (schema.additionalProperties !== undefined) {
          check(schema.additionalProperties as Schema, item, `${path}.${k}`, out);
        }
      }
    }
  };
  check(root, JSON.parse(JSON.stringify(value)) as Json, '$', errors);
  return errors;
}

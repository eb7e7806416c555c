// Plain-language rows for a schema's fields (name, type, required, limits), read from the built OpenAPI document, for
// the API page. Only the first level is listed; nested objects name their component.
import type { JsonObject } from './embed-schemas';

export type FieldRow = { name: string; type: string; required: boolean; description: string | null; limits: string[] };

const isObject = (v: unknown): v is JsonObject => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The node a local "#/…" reference points at, or undefined. */
export function resolvePointer(doc: JsonObject, ref: string): JsonObject | undefined {
  if (!ref.startsWith('#/')) return undefined;
  let node: unknown = doc;
  for (const raw of ref.slice(2).split('/')) {
    const key = raw.replace(/~1/g, '/').replace(/~0/g, '~');
    node = isObject(node) ? node[key] : undefined;
  }
  return isObject(node) ? node : undefined;
}

/** Follows $ref chains (at most 10), keeping the usage site's own title and description in front. */
export function deref(doc: JsonObject, schema: JsonObject): JsonObject {
  let merged: JsonObject = { ...schema };
  for (let hops = 0; typeof merged.$ref === 'string' && hops < 10; hops++) {
    const { $ref, ...own } = merged;
    merged = { ...(resolvePointer(doc, $ref as string) ?? {}), ...own };
  }
  return merged;
}

const componentOf = (ref: unknown) => (typeof ref === 'string' ? /^#\/components\/schemas\/([^/]+)(?:\/\$defs\/([^/]+))?$/.exec(ref) : null);

/** "text", "whole number or empty", "one of raw, processed, other", "list of Creator", … */
export function typeText(doc: JsonObject, schema: JsonObject): string {
  const named = componentOf(schema.$ref);
  if (named) {
    const target = deref(doc, { $ref: schema.$ref });
    if (target.enum) return typeText(doc, target);
    if (target.type === 'object' || target.properties) return named[2] ? named[2][0].toUpperCase() + named[2].slice(1) : named[1];
  }
  const s = deref(doc, schema);
  if (Array.isArray(s.enum)) return `one of ${s.enum.map((v) => (v === null ? 'null' : String(v))).join(', ')}`;
  if (s.const !== undefined) return `always ${JSON.stringify(s.const)}`;
  const types = Array.isArray(s.type) ? s.type : s.type ? [s.type] : [];
  const words = types.map((t) => {
    if (t === 'array' && isObject(s.items)) return `list of ${typeText(doc, s.items)}`;
    if (t === 'string' && typeof s.format === 'string') return `text (${s.format})`;
    return ({ string: 'text', integer: 'whole number', number: 'number', boolean: 'true or false', object: 'object', null: 'null', array: 'list' } as Record<string, string>)[String(t)] ?? String(t);
  });
  return words.length ? words.join(' or ') : 'any';
}

function limitsOf(s: JsonObject): string[] {
  const out: string[] = [];
  const range = (min: unknown, max: unknown, unit: string) => {
    if (min !== undefined && max !== undefined) out.push(`${min}–${max}${unit}`);
    else if (min !== undefined) out.push(`at least ${min}${unit}`);
    else if (max !== undefined) out.push(`at most ${max}${unit}`);
  };
  range(s.minLength, s.maxLength, ' characters');
  range(s.minItems, s.maxItems, ' entries');
  // The largest safe integer is a technical bound, not a limit worth reading.
  range(s.minimum, s.maximum === Number.MAX_SAFE_INTEGER ? undefined : s.maximum, '');
  if (s.exclusiveMinimum !== undefined) out.push(`above ${s.exclusiveMinimum}`);
  // Short patterns say something at a glance (^[0-9a-f]{64}$); long ones are for the schema, not the page.
  if (typeof s.pattern === 'string' && s.pattern !== '\\S' && s.pattern.length <= 32) out.push(`pattern ${s.pattern}`);
  return out;
}

/** Top-level fields of an object schema (allOf parts merged), required ones first, each with its limits. */
export function fieldRows(doc: JsonObject, schema: JsonObject): FieldRow[] {
  const s = deref(doc, schema);
  const parts = [s, ...(Array.isArray(s.allOf) ? s.allOf.filter(isObject).map((p) => deref(doc, p)) : [])];
  const required = new Set(parts.flatMap((p) => (Array.isArray(p.required) ? (p.required as string[]) : [])));
  const rows: FieldRow[] = [];
  for (const part of parts) {
    for (const [name, raw] of Object.entries(isObject(part.properties) ? part.properties : {})) {
      if (!isObject(raw) || rows.some((r) => r.name === name)) continue;
      const prop = deref(doc, raw);
      const text = [prop.title, prop.description].filter((t): t is string => typeof t === 'string' && t.length > 0);
      rows.push({ name, type: typeText(doc, raw), required: required.has(name), description: text.length ? text.join('. ').replace(/\.\./g, '.') : null, limits: limitsOf(prop) });
    }
  }
  return rows.sort((a, b) => Number(b.required) - Number(a.required));
}

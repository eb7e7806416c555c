// Turns the JSON Schema files into OpenAPI components/schemas without copying them by hand: each file becomes one
// component, and its $refs (local "#/$defs/…" and absolute "$id#…") are rewritten to point inside the document.

export type JsonObject = { [key: string]: unknown };

/** Keywords whose value is a map of name → schema (JSON Schema 2020-12 core and applicator vocabularies). */
const SCHEMA_MAPS = new Set(['properties', 'patternProperties', '$defs', 'dependentSchemas']);
/** Keywords whose value is an array of schemas. */
const SCHEMA_ARRAYS = new Set(['allOf', 'anyOf', 'oneOf', 'prefixItems']);
/** Keywords whose value is one schema. */
const SCHEMA_VALUES = new Set([
  'items', 'additionalProperties', 'not', 'if', 'then', 'else', 'contains', 'propertyNames', 'unevaluatedItems', 'unevaluatedProperties',
]);

export const COMPONENT_PREFIX = '#/components/schemas/';

/** "schemas/api/responses/file-result.schema.json" → "FileResult". */
export function componentName(path: string): string {
  const base = path.split('/').pop()?.replace(/\.schema\.json$/, '').replace(/\.json$/, '') ?? path;
  return base.split(/[^A-Za-z0-9]+/).filter(Boolean).map((w) => w[0].toUpperCase() + w.slice(1)).join('');
}

const isObject = (v: unknown): v is JsonObject => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Copies a schema, applying `rewrite` to every $ref in schema position; annotation values (examples, enum, const, default) are copied as data. */
export function mapRefs(schema: unknown, rewrite: (ref: string) => string): unknown {
  if (typeof schema === 'boolean' || !isObject(schema)) return schema;
  const out: JsonObject = {};
  for (const [key, value] of Object.entries(schema)) {
    if (key === '$ref' && typeof value === 'string') out[key] = rewrite(value);
    else if (SCHEMA_VALUES.has(key)) out[key] = mapRefs(value, rewrite);
    else if (SCHEMA_ARRAYS.has(key) && Array.isArray(value)) out[key] = value.map((s) => mapRefs(s, rewrite));
    else if (SCHEMA_MAPS.has(key) && isObject(value)) out[key] = Object.fromEntries(Object.entries(value).map(([k, s]) => [k, mapRefs(s, rewrite)]));
    else out[key] = structuredClone(value);
  }
  return out;
}

export type EmbeddedSchemas = {
  /** Component name → schema, ready for components.schemas. */
  schemas: Record<string, JsonObject>;
  /** Schema file path → component name. */
  byFile: Map<string, string>;
};

/**
 * Every schema file as a component: $schema and $id are dropped (the document declares the dialect, and an $id would
 * re-base the rewritten refs), the source is noted in $comment, and each $ref is rewritten to #/components/schemas/….
 */
export function embedSchemas(files: readonly (readonly [string, object])[]): EmbeddedSchemas {
  const byFile = new Map<string, string>();
  const byId = new Map<string, string>();
  for (const [path, schema] of files) {
    const name = componentName(path);
    if ([...byFile.values()].includes(name)) throw new Error(`Two schema files would both be component ${name}: rename ${path}.`);
    byFile.set(path, name);
    const id = (schema as JsonObject).$id;
    if (typeof id === 'string') byId.set(id, name);
  }
  const schemas: Record<string, JsonObject> = {};
  for (const [path, schema] of files) {
    const self = byFile.get(path)!;
    const rewrite = (ref: string): string => {
      const hash = ref.indexOf('#');
      const base = hash < 0 ? ref : ref.slice(0, hash);
      const fragment = hash < 0 ? '' : ref.slice(hash + 1);
      if (fragment !== '' && !fragment.startsWith('/')) throw new Error(`${path}: anchor $ref "${ref}" is not supported; use a JSON pointer.`);
      const target = base === '' ? self : byId.get(base);
      if (!target) throw new Error(`${path}: $ref "${ref}" names no schema file in lib/openapi/schema-files.ts.`);
      return `${COMPONENT_PREFIX}${target}${fragment}`;
    };
    const rest = mapRefs(schema, rewrite) as JsonObject;
    const id = rest.$id;
    delete rest.$schema;
    delete rest.$id;
    const source = `Source: ${path}${typeof id === 'string' ? ` ($id ${id})` : ''}.`;
    schemas[self] = { ...rest, $comment: typeof rest.$comment === 'string' ? `${source} ${rest.$comment}` : source };
  }
  return { schemas, byFile };
}

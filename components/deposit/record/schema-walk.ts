import schema from '@/schemas/transport-dataset.schema.json';

// The record form is drawn from schemas/transport-dataset.schema.json: titles, descriptions, enums and unit lists
// are read here, never written a second time in the UI.

export type JsonSchema = {
  title?: string;
  description?: string;
  type?: string | string[];
  enum?: (string | number)[];
  $ref?: string;
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  pattern?: string;
  examples?: unknown[];
  $defs?: Record<string, JsonSchema>;
};

const ROOT = schema as unknown as JsonSchema;

/** The node a $ref chain ends at, with the usage site's title and description winning over the definition's. */
export function resolveNode(node: JsonSchema | undefined): JsonSchema | undefined {
  if (!node) return undefined;
  let current: JsonSchema | undefined = node;
  for (let hops = 0; current?.$ref && hops < 10; hops++) current = ROOT.$defs?.[current.$ref.replace(/^#\/\$defs\//, '')];
  if (!current) return undefined;
  return { ...current, title: node.title ?? current.title, description: node.description ?? current.description };
}

/** Schema node of the field at `path` ('sample', 'geometry', 'thickness'; array items by any index). */
export function nodeAt(path: readonly (string | number)[]): JsonSchema | undefined {
  let node: JsonSchema | undefined = resolveNode(ROOT);
  for (const seg of path) {
    if (!node) return undefined;
    node = typeof seg === 'number' || /^\d+$/.test(seg) ? resolveNode(node.items) : resolveNode(node.properties?.[seg]);
  }
  return node;
}

export type FieldKind = 'text' | 'longtext' | 'number' | 'integer' | 'choice' | 'quantity' | 'group' | 'list' | 'tags';

/** An object of exactly { value, unit } with a unit list is shown as one number-with-unit field. */
function isQuantity(node: JsonSchema): boolean {
  const keys = Object.keys(node.properties ?? {});
  return keys.length === 2 && keys.includes('value') && keys.includes('unit') && Boolean(resolveNode(node.properties?.unit)?.enum);
}

export function kindOf(node: JsonSchema): FieldKind {
  if (node.enum) return 'choice';
  if (node.type === 'object') return isQuantity(node) ? 'quantity' : 'group';
  if (node.type === 'array') return resolveNode(node.items)?.type === 'string' ? 'tags' : 'list';
  if (node.type === 'number') return 'number';
  if (node.type === 'integer') return 'integer';
  return (node.maxLength ?? 0) > 1000 ? 'longtext' : 'text';
}

/** Property names of an object node, in the schema's order. */
export function childKeys(node: JsonSchema): string[] {
  return Object.keys(node.properties ?? {});
}

export function isRequired(parent: JsonSchema | undefined, key: string): boolean {
  return Boolean(parent?.required?.includes(key));
}

/** Unit codes allowed for a { value, unit } field. */
export function unitChoices(node: JsonSchema): string[] {
  return (resolveNode(node.properties?.unit)?.enum ?? []).map(String);
}

// Acronyms and names in enum values that read better as the trade writes them.
const SPELLING: Readonly<Record<string, string>> = { dc: 'DC', ac: 'AC', hall: 'Hall', pauw: 'Pauw', 'lock-in': 'lock\u2011in' };

/** 'four-wire-linear' → 'Four wire linear', 'dc-reversal' → 'DC reversal'; identifiers like 'CC-BY-4.0' stay. */
export function choiceLabel(value: string | number): string {
  const text = String(value);
  if (typeof value === 'number' || /[A-Z0-9]/.test(text.replace(/^[a-z]/, ''))) return text;
  const words = text.replace(/lock-in/g, 'lock~in').split('-').map((w) => SPELLING[w.replace('~', '-')] ?? w.replace('~', '-'));
  const sentence = words.join(' ');
  return sentence.charAt(0).toUpperCase() + sentence.slice(1);
}

/** First example of a text field, for a placeholder ("e.g. 0000-0000-3141-5920"). */
export function exampleOf(node: JsonSchema): string | undefined {
  const first = node.examples?.[0];
  return typeof first === 'string' ? first : undefined;
}

/** DOM id of the field at a dotted record path, so error summaries can link to it. */
export function fieldId(path: readonly (string | number)[]): string {
  return `rec-${path.join('-')}`;
}

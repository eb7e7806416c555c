// Finds the human title of a field by walking the schema along an instance path (browser-safe, no Ajv).
type SchemaNode = {
  title?: string;
  $ref?: string;
  properties?: Record<string, SchemaNode>;
  items?: SchemaNode;
  $defs?: Record<string, SchemaNode>;
};

function resolve(root: SchemaNode, node: SchemaNode | undefined): SchemaNode | undefined {
  let current = node;
  for (let hops = 0; current?.$ref && hops < 10; hops++) {
    const name = current.$ref.replace(/^#\/\$defs\//, '');
    current = root.$defs?.[name];
  }
  return current;
}

/** Title of each segment (usage-site title first, then the referenced definition's), undefined where none. */
export function titlesAlong(root: SchemaNode, segments: readonly string[]): (string | undefined)[] {
  const titles: (string | undefined)[] = [];
  let node: SchemaNode | undefined = root;
  for (const seg of segments) {
    const target = resolve(root, node);
    const next: SchemaNode | undefined = /^\d+$/.test(seg) ? target?.items : target?.properties?.[seg];
    titles.push(next?.title ?? resolve(root, next)?.title);
    node = next;
  }
  return titles;
}

/** Plain label for the field at `segments`: a `.value` takes its parent's title, a `.unit` reads "<parent> unit". */
export function fieldLabel(root: SchemaNode, segments: readonly string[]): string {
  if (segments.length === 0) return 'the dataset record';
  const titles = titlesAlong(root, segments);
  const last = segments[segments.length - 1];
  const parentTitle = titles[titles.length - 2];
  if (last === 'value' && parentTitle) return parentTitle;
  if (last === 'unit' && parentTitle) return `${parentTitle} unit`;
  const own = titles[titles.length - 1];
  if (own) return /^\d+$/.test(last) ? `${own} ${Number(last) + 1}` : own;
  // Array items without a title of their own: "Creators entry 2".
  if (/^\d+$/.test(last) && parentTitle) return `${parentTitle} entry ${Number(last) + 1}`;
  return `"${last}"`;
}

export type { SchemaNode };

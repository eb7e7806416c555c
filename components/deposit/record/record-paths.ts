// Immutable reads and writes at a path in the draft record (plain JSON), used by every form field.

export type RecordPath = readonly (string | number)[];
type Json = unknown;

function isObject(value: Json): value is Record<string, Json> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

export function getAt(record: Json, path: RecordPath): Json {
  let current = record;
  for (const seg of path) {
    if (Array.isArray(current) && typeof seg === 'number') current = current[seg];
    else if (isObject(current)) current = current[String(seg)];
    else return undefined;
  }
  return current;
}

function isEmptyObject(value: Json): boolean {
  return isObject(value) && Object.keys(value).length === 0;
}

/**
 * A copy of `record` with `value` at `path` (missing objects and arrays created). `undefined` removes the key, and
 * objects left empty by that are removed too, so a cleared field leaves no `{}` behind; list entries stay.
 */
export function setAt(record: Json, path: RecordPath, value: Json): Json {
  if (path.length === 0) return value;
  const [head, ...rest] = path;
  if (typeof head === 'number') {
    const list = Array.isArray(record) ? [...record] : [];
    for (let i = list.length; i < head; i++) list[i] = {}; // no holes: JSON would write them as null
    list[head] = setAt(list[head], rest, value);
    if (list[head] === undefined) list[head] = {}; // an entry the author added stays until they remove it
    return list;
  }
  const object: Record<string, Json> = isObject(record) ? { ...record } : {};
  const next = setAt(object[head], rest, value);
  if (next === undefined || (rest.length > 0 && isEmptyObject(next))) delete object[head];
  else object[head] = next;
  return object;
}

/** A copy without entry `index` of the list at `path`; an emptied list is removed. */
export function removeAt(record: Json, path: RecordPath, index: number): Json {
  const list = getAt(record, path);
  if (!Array.isArray(list)) return record;
  const next = list.filter((_, i) => i !== index);
  return setAt(record, path, next.length ? next : undefined);
}

/** Dotted form used by validation errors: ['creators', 0, 'name'] → 'creators.0.name'. */
export function dotted(path: RecordPath): string {
  return path.join('.');
}

'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { describedBy, FieldFrame, INPUT_CLASS, inputBorder } from './field-parts';
import { useRecordForm } from './record-context';
import { dotted, getAt, type RecordPath } from './record-paths';
import { SchemaField } from './schema-field';
import { childKeys, fieldId, isRequired, kindOf, nodeAt, resolveNode, type JsonSchema } from './schema-walk';

type GroupProps = { path: RecordPath; node: JsonSchema; omit?: string[]; legend?: string };

const WIDE = new Set(['group', 'list', 'longtext', 'tags']);

/** An object of the schema as a fieldset; simple fields in a grid, nested groups and lists full width. */
export function GroupField({ path, node, omit = [], legend }: GroupProps) {
  const keys = childKeys(node).filter((k) => !omit.includes(k));
  const title = legend ?? node.title;
  const items = keys.map((key) => {
    const child = nodeAt([...path, key]);
    // Lists, groups and long texts take the whole row; a title-length text two thirds of it.
    const wide = child ? WIDE.has(kindOf(child)) : false;
    const long = child ? kindOf(child) === 'text' && (child.maxLength ?? 0) >= 300 : false;
    return (
      <SchemaField key={key} path={[...path, key]} required={isRequired(node, key)} className={wide ? 'sm:col-span-2 lg:col-span-3' : long ? 'sm:col-span-2' : ''} />
    );
  });
  const body = <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">{items}</div>;
  if (path.length === 0 || !title) return body;
  return (
    <fieldset className="rounded-md border border-slate-200 p-4 sm:col-span-2 lg:col-span-3" id={fieldId(path)}>
      <legend className="px-1 text-sm font-semibold text-slate-800">{title}</legend>
      {node.description && <p className="mb-3 text-xs text-slate-600">{node.description}</p>}
      {body}
    </fieldset>
  );
}

/** A list of objects (creators, affiliations, related identifiers, funding): add and remove entries. */
export function ListField({ path, node }: { path: RecordPath; node: JsonSchema }) {
  const { record, set, remove, errors, readOnly } = useRecordForm();
  const itemNode = resolveNode(node.items);
  const list = getAt(record, path);
  const entries = Array.isArray(list) ? list : [];
  const itemTitle = itemNode?.title ?? 'entry';
  const error = errors[dotted(path)];
  if (!itemNode) return null;
  return (
    <fieldset className="rounded-md border border-slate-200 p-4 sm:col-span-2 lg:col-span-3" id={fieldId(path)}>
      <legend className="px-1 text-sm font-semibold text-slate-800">{node.title}</legend>
      {error && <p role="alert" className="mb-2 text-sm text-red-700">{error}</p>}
      <ol className="flex flex-col gap-3">
        {entries.map((_, i) => (
          <li key={i} className="rounded-md bg-slate-50 p-3">
            <div className="mb-2 flex items-center justify-between gap-2">
              <p className="text-sm font-medium text-slate-700">{`${itemTitle} ${i + 1}`}</p>
              {!readOnly && (
                <Button type="button" variant="quiet" className="px-2 py-1 text-xs" onClick={() => remove(path, i)}>
                  Remove {itemTitle.toLowerCase()} {i + 1}
                </Button>
              )}
            </div>
            <GroupField path={[...path, i]} node={itemNode} legend="" />
          </li>
        ))}
      </ol>
      {entries.length === 0 && <p className="text-sm text-slate-600">None yet.</p>}
      {!readOnly && (
        <Button type="button" variant="secondary" className="mt-3" onClick={() => set([...path, entries.length], {})}>
          Add {itemTitle.toLowerCase()}
        </Button>
      )}
    </fieldset>
  );
}

/** A list of short texts (keywords), typed comma-separated; committed as a list when the field is left. */
export function TagsField({ path, node, className = '' }: { path: RecordPath; node: JsonSchema; className?: string }) {
  const { record, set, errors, readOnly } = useRecordForm();
  const id = fieldId(path);
  const list = getAt(record, path);
  const joined = Array.isArray(list) ? list.join(', ') : '';
  const [draft, setDraft] = useState<string | null>(null);
  const error = errors[dotted(path)] ?? Object.entries(errors).find(([k]) => k.startsWith(`${dotted(path)}.`))?.[1];
  const hint = 'Separate entries with commas.';
  const commit = (text: string) => {
    const items = text.split(',').map((s) => s.trim()).filter(Boolean);
    set(path, items.length ? items : undefined);
    setDraft(null);
  };
  return (
    <FieldFrame id={id} label={node.title ?? 'List'} hint={hint} error={error} className={className}>
      <input
        id={id}
        type="text"
        value={draft ?? joined}
        disabled={readOnly}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error)}
        className={`${INPUT_CLASS} ${inputBorder(error)}`}
        onChange={(e) => setDraft(e.target.value)}
        onBlur={(e) => commit(e.target.value)}
        onKeyDown={(e) => {
          if (e.key === 'Enter') {
            e.preventDefault();
            commit(e.currentTarget.value);
          }
        }}
      />
    </FieldFrame>
  );
}

'use client';

import { useState } from 'react';
import { unitLabel } from '@/lib/format/quantity';
import { describedBy, FieldFrame, INPUT_CLASS, inputBorder } from './field-parts';
import { GroupField, ListField, TagsField } from './group-field';
import { numberToText, parseNumberText, textMatches } from './number-text';
import { QuantityField } from './quantity-field';
import { useRecordForm } from './record-context';
import { dotted, getAt, type RecordPath } from './record-paths';
import { choiceLabel, exampleOf, fieldId, kindOf, nodeAt, type JsonSchema } from './schema-walk';

export type SchemaFieldProps = { path: RecordPath; required?: boolean; omit?: string[]; className?: string };

/** One field of the dataset record, drawn from the schema node at `path`. */
export function SchemaField({ path, required, omit, className }: SchemaFieldProps) {
  const node = nodeAt(path);
  if (!node) return null;
  switch (kindOf(node)) {
    case 'group':
      return <GroupField path={path} node={node} omit={omit} />;
    case 'list':
      return <ListField path={path} node={node} />;
    case 'tags':
      return <TagsField path={path} node={node} className={className} />;
    case 'quantity':
      return <QuantityField path={path} node={node} required={required} className={className} />;
    case 'choice':
      return <ChoiceField path={path} node={node} required={required} className={className} />;
    case 'number':
    case 'integer':
      return <NumberField path={path} node={node} required={required} className={className} />;
    default:
      return <TextField path={path} node={node} required={required} className={className} />;
  }
}

type LeafProps = { path: RecordPath; node: JsonSchema; required?: boolean; className?: string };

function TextField({ path, node, required, className }: LeafProps) {
  const { record, set, errors, readOnly } = useRecordForm();
  const id = fieldId(path);
  const value = getAt(record, path);
  const error = errors[dotted(path)];
  const example = exampleOf(node);
  const long = kindOf(node) === 'longtext';
  const common = {
    id,
    value: typeof value === 'string' ? value : '',
    disabled: readOnly,
    maxLength: node.maxLength,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': describedBy(id, node.description, error),
    'aria-required': required || undefined,
    placeholder: example ? `e.g. ${example}` : undefined,
    className: `${INPUT_CLASS} ${inputBorder(error)}`,
  };
  const onText = (text: string) => set(path, text === '' ? undefined : text);
  return (
    <FieldFrame id={id} label={node.title ?? String(path[path.length - 1])} required={required} hint={node.description} error={error} className={className}>
      {long ? <textarea rows={5} {...common} onChange={(e) => onText(e.target.value)} /> : <input type="text" {...common} onChange={(e) => onText(e.target.value)} />}
    </FieldFrame>
  );
}

function NumberField({ path, node, required, className }: LeafProps) {
  const { record, set, errors, readOnly } = useRecordForm();
  const id = fieldId(path);
  const value = getAt(record, path);
  const [text, setText] = useState(numberToText(value));
  const shown = textMatches(text, value) ? text : numberToText(value);
  const error = errors[dotted(path)];
  return (
    <FieldFrame id={id} label={node.title ?? String(path[path.length - 1])} required={required} hint={node.description} error={error} className={className}>
      <input
        id={id}
        type="text"
        inputMode={node.type === 'integer' ? 'numeric' : 'decimal'}
        value={shown}
        disabled={readOnly}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, node.description, error)}
        className={`${INPUT_CLASS} ${inputBorder(error)} num`}
        onChange={(e) => {
          setText(e.target.value);
          set(path, parseNumberText(e.target.value));
        }}
      />
    </FieldFrame>
  );
}

/** Label of one enum value: units by their symbol, other values in words. */
export function optionLabel(node: JsonSchema, value: string | number): string {
  return /unit/i.test(node.title ?? '') ? `${unitLabel(String(value))} (${value})` : choiceLabel(value);
}

function ChoiceField({ path, node, required, className }: LeafProps) {
  const { record, set, errors, readOnly } = useRecordForm();
  const id = fieldId(path);
  const value = getAt(record, path);
  const error = errors[dotted(path)];
  const options = node.enum ?? [];
  const index = options.findIndex((o) => o === value);
  // Unit lists say 'UCUM code.' for developers; the author sees the unit symbols instead.
  const hint = node.description?.replace(/^UCUM code[.;]?\s*/, '') || undefined;
  return (
    <FieldFrame id={id} label={node.title ?? String(path[path.length - 1])} required={required} hint={hint} error={error} className={className}>
      <select
        id={id}
        value={index >= 0 ? String(index) : value === undefined ? '' : 'other'}
        disabled={readOnly}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error)}
        className={`${INPUT_CLASS} ${inputBorder(error)}`}
        onChange={(e) => set(path, e.target.value === '' ? undefined : options[Number(e.target.value)])}
      >
        <option value="">— not set —</option>
        {index < 0 && value !== undefined && <option value="other">{String(value)} (not in the list)</option>}
        {options.map((o, i) => (
          <option key={String(o)} value={String(i)}>{optionLabel(node, o)}</option>
        ))}
      </select>
    </FieldFrame>
  );
}

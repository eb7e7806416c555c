'use client';

import { useState } from 'react';
import { unitLabel } from '@/lib/format/quantity';
import { describedBy, FieldError, INPUT_BASE, inputBorder } from './field-parts';
import { numberToText, parseNumberText, textMatches } from './number-text';
import { useRecordForm } from './record-context';
import { dotted, getAt, type RecordPath } from './record-paths';
import { fieldId, resolveNode, unitChoices, type JsonSchema } from './schema-walk';

export type QuantityFieldProps = { path: RecordPath; node: JsonSchema; required?: boolean; className?: string };

/** A { value, unit } pair of the schema as one field: the number and its unit from the schema's unit list. */
export function QuantityField({ path, node, required, className = '' }: QuantityFieldProps) {
  const { record, set, errors, readOnly } = useRecordForm();
  const id = fieldId(path);
  const unitId = fieldId([...path, 'unit']);
  const valuePath = [...path, 'value'];
  const unitPath = [...path, 'unit'];
  const value = getAt(record, valuePath);
  const unit = getAt(record, unitPath);
  const [text, setText] = useState(numberToText(value));
  const shown = textMatches(text, value) ? text : numberToText(value);
  const units = unitChoices(node);
  const valueError = errors[dotted(valuePath)] ?? errors[dotted(path)];
  const unitError = errors[dotted(unitPath)];
  const unitTitle = resolveNode(node.properties?.unit)?.title ?? 'Unit';
  const label = node.title ?? String(path[path.length - 1]);
  const hint = node.description;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-medium text-slate-800">
        {label}
        {required && <span className="ml-1 text-xs font-normal text-slate-500">(required)</span>}
      </label>
      <div className="flex gap-2">
        <input
          id={id}
          type="text"
          inputMode="decimal"
          value={shown}
          disabled={readOnly}
          aria-invalid={valueError ? true : undefined}
          aria-describedby={describedBy(id, hint, valueError)}
          className={`${INPUT_BASE} ${inputBorder(valueError)} num w-0 min-w-0 flex-1`}
          onChange={(e) => {
            setText(e.target.value);
            set(valuePath, parseNumberText(e.target.value));
          }}
        />
        <label htmlFor={unitId} className="sr-only">{`${label}: ${unitTitle.toLowerCase()}`}</label>
        <select
          id={unitId}
          value={typeof unit === 'string' ? unit : ''}
          disabled={readOnly}
          aria-invalid={unitError ? true : undefined}
          aria-describedby={describedBy(unitId, undefined, unitError)}
          className={`${INPUT_BASE} ${inputBorder(unitError)} w-24 flex-none px-2`}
          onChange={(e) => set(unitPath, e.target.value === '' ? undefined : e.target.value)}
        >
          <option value="">unit</option>
          {typeof unit === 'string' && !units.includes(unit) && <option value={unit}>{unit} (not in the list)</option>}
          {units.map((u) => (
            <option key={u} value={u}>{unitLabel(u)}</option>
          ))}
        </select>
      </div>
      {hint && <p id={`${id}-hint`} className="text-xs text-slate-600">{hint}</p>}
      <FieldError id={id} error={valueError} />
      <FieldError id={unitId} error={unitError} />
    </div>
  );
}

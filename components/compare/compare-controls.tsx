'use client';

import { useId, type ReactNode } from 'react';
import type { AxisPair } from '@/lib/compare/choose-axes';
import type { Normalisation } from '@/lib/compare/normalise';
import type { OverlaySettings } from '@/lib/compare/prepare-overlay';
import { axisTitle, parseAxisKey, quantityText } from '@/lib/compare/quantities';
import { OERSTED_CONVENTION_NOTE, type DisplayUnit, type UnitSystem } from '@/lib/compare/units';

export type CompareControlsProps = {
  pairs: AxisPair[];
  entryCount: number;
  settings: OverlaySettings;
  xUnits: readonly DisplayUnit[];
  yUnits: readonly DisplayUnit[];
  onChange: (patch: Partial<OverlaySettings>) => void;
  onUnitSystem: (system: UnitSystem) => void;
};

const SELECT = 'w-full rounded-md border border-slate-400 bg-white px-2 py-1.5 text-sm';
const LABEL = 'text-sm font-medium text-slate-800';

function Field({ label, id, children }: { label: string; id: string; children: ReactNode }) {
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className={LABEL}>{label}</label>
      {children}
    </div>
  );
}

/** The reader's choices: quantities, units (SI or the practitioner's), normalisation, log axes. */
export function CompareControls({ pairs, entryCount, settings: s, xUnits, yUnits, onChange, onUnitSystem }: CompareControlsProps) {
  const id = useId();
  const xKeys = [...new Set(pairs.map((p) => p.xKey))];
  const yPairs = pairs.filter((p) => p.xKey === s.xKey);
  const x = parseAxisKey(s.xKey);
  const xUnit = xUnits.find((u) => u.ucum === s.xUnit) ?? xUnits[0];
  const normalised = s.normalisation.kind !== 'none';
  const xSymbol = quantityText(x.quantity).symbol;
  const ySymbol = quantityText(parseAxisKey(s.yKey).quantity).symbol;
  const count = (n: number) => (entryCount > 1 ? ` (${n} of ${entryCount})` : '');

  const setNormalisation = (kind: Normalisation['kind']) => {
    if (kind === 'at-x') onChange({ normalisation: { kind, x: x.quantity === 'temperature' ? 300 : 0 } });
    else onChange({ normalisation: { kind } as Normalisation });
  };

  return (
    <fieldset className="grid grid-cols-1 gap-3 rounded-md border border-slate-200 bg-white p-3 sm:grid-cols-2 lg:grid-cols-4">
      <legend className="sr-only">What to overlay and how</legend>
      <Field label="x quantity" id={`${id}-x`}>
        <select id={`${id}-x`} className={SELECT} value={s.xKey} onChange={(e) => onChange({ xKey: e.target.value })}>
          {xKeys.map((k) => <option key={k} value={k}>{axisTitle(k)}</option>)}
        </select>
      </Field>
      <Field label="y quantity" id={`${id}-y`}>
        <select id={`${id}-y`} className={SELECT} value={s.yKey} onChange={(e) => onChange({ yKey: e.target.value })}>
          {yPairs.map((p) => <option key={p.yKey} value={p.yKey}>{`${axisTitle(p.yKey)}${count(p.entries)}`}</option>)}
        </select>
      </Field>
      <Field label="x unit" id={`${id}-xu`}>
        <select id={`${id}-xu`} className={SELECT} value={s.xUnit} onChange={(e) => onChange({ xUnit: e.target.value })}>
          {xUnits.map((u) => <option key={u.ucum} value={u.ucum}>{u.label}{u.convention ? ' (lab convention)' : ''}</option>)}
        </select>
      </Field>
      <Field label="y unit" id={`${id}-yu`}>
        <select id={`${id}-yu`} className={SELECT} value={normalised ? '1' : s.yUnit} disabled={normalised} onChange={(e) => onChange({ yUnit: e.target.value })}>
          {normalised ? <option value="1">ratio (normalised)</option> : yUnits.map((u) => <option key={u.ucum} value={u.ucum}>{u.label}</option>)}
        </select>
      </Field>
      <Field label="Normalise" id={`${id}-n`}>
        <select id={`${id}-n`} className={SELECT} value={s.normalisation.kind} onChange={(e) => setNormalisation(e.target.value as Normalisation['kind'])}>
          <option value="none">No ({ySymbol} as measured)</option>
          <option value="at-x">{`${ySymbol}/${ySymbol}(${xSymbol}) at a chosen ${xSymbol}`}</option>
          {x.quantity === 'field' && <option value="zero-field">{`${ySymbol}/${ySymbol}(${xSymbol} = 0)`}</option>}
          <option value="max">{`${ySymbol}/max|${ySymbol}|`}</option>
        </select>
      </Field>
      {s.normalisation.kind === 'at-x' && (
        <Field label={`Reference ${xSymbol} (${xUnit.label || '1'})`} id={`${id}-ref`}>
          <input
            id={`${id}-ref`}
            type="number"
            step="any"
            inputMode="decimal"
            className={`${SELECT} num`}
            // Stored in SI; shown and typed in the chosen x unit.
            defaultValue={Number((s.normalisation.x / xUnit.factor).toPrecision(6))}
            key={`${xUnit.ucum}-${s.xKey}`}
            onChange={(e) => {
              const v = Number(e.target.value);
              if (e.target.value !== '' && Number.isFinite(v)) onChange({ normalisation: { kind: 'at-x', x: v * xUnit.factor } });
            }}
          />
        </Field>
      )}
      <div className="flex flex-col gap-1">
        <span className={LABEL} id={`${id}-log`}>Axes</span>
        <div className="flex flex-wrap gap-x-4 gap-y-1 py-1.5" role="group" aria-labelledby={`${id}-log`}>
          <label className="flex items-center gap-2 text-sm text-slate-800">
            <input type="checkbox" checked={s.logX} onChange={(e) => onChange({ logX: e.target.checked })} className="h-4 w-4 accent-copper-600" />
            Log x
          </label>
          <label className="flex items-center gap-2 text-sm text-slate-800">
            <input type="checkbox" checked={s.logY} onChange={(e) => onChange({ logY: e.target.checked })} className="h-4 w-4 accent-copper-600" />
            Log y
          </label>
        </div>
      </div>
      <div className="flex flex-col gap-1">
        <span className={LABEL} id={`${id}-sys`}>Unit system</span>
        <div className="flex flex-wrap gap-2" role="group" aria-labelledby={`${id}-sys`}>
          <button type="button" onClick={() => onUnitSystem('practitioner')} className="rounded-md border border-slate-300 bg-white px-2.5 py-1.5 text-sm hover:bg-slate-100">
            Practitioner&apos;s
          </button>
          <button type="button" onClick={() => onUnitSystem('si')} className="rounded-md border border-slate-300 bg-white px-2.5 py-1.5 text-sm hover:bg-slate-100">
            All SI
          </button>
        </div>
      </div>
      {xUnit.convention && <p className="text-xs text-slate-600 sm:col-span-2 lg:col-span-4">{OERSTED_CONVENTION_NOTE}</p>}
    </fieldset>
  );
}

'use client';

import { useMemo, useState } from 'react';
import { axisPairs, optionFor } from '@/lib/compare/choose-axes';
import type { Normalisation } from '@/lib/compare/normalise';
import { prepareOverlay, type OverlaySettings } from '@/lib/compare/prepare-overlay';
import { parseAxisKey } from '@/lib/compare/quantities';
import type { CompareEntry } from '@/lib/compare/types';
import { preferredUnit, unitOptions, type UnitSystem } from '@/lib/compare/units';

function maxAbs(entries: readonly CompareEntry[], xKey: string, yKey: string, k: 0 | 1): number {
  let m = 0;
  for (const e of entries) for (const p of optionFor(e, xKey, yKey)?.points ?? []) if (Number.isFinite(p[k])) m = Math.max(m, Math.abs(p[k]));
  return m;
}

/**
 * The reader's overlay settings with sensible defaults that follow the basket: the quantity pair most curves share,
 * each axis in the practitioner's unit for its values (or SI), no normalisation, linear axes.
 */
export function useOverlaySettings(entries: readonly CompareEntry[]) {
  const [pair, setPair] = useState<{ xKey: string; yKey: string } | null>(null);
  const [unitChoice, setUnitChoice] = useState<Record<string, string>>({});
  const [system, setSystem] = useState<UnitSystem>('practitioner');
  const [normalisation, setNormalisation] = useState<Normalisation>({ kind: 'none' });
  const [log, setLog] = useState({ x: false, y: false });

  const pairs = useMemo(() => axisPairs(entries), [entries]);
  const active = pairs.find((p) => p.xKey === pair?.xKey && p.yKey === pair?.yKey) ?? pairs.find((p) => p.xKey === pair?.xKey) ?? pairs[0];
  const x = active ? parseAxisKey(active.xKey) : null;
  const y = active ? parseAxisKey(active.yKey) : null;
  const xUnits = x ? unitOptions(x.ucum) : [];
  const yUnits = y ? unitOptions(y.ucum) : [];
  const pick = (units: typeof xUnits, ucum: string | null, k: 0 | 1) => {
    const chosen = units.find((u) => u.ucum === unitChoice[ucum ?? '?']);
    return chosen?.ucum ?? preferredUnit(ucum, active ? maxAbs(entries, active.xKey, active.yKey, k) : 0, system).ucum;
  };
  const settings: OverlaySettings | null = active && x && y
    ? {
      xKey: active.xKey, yKey: active.yKey, xUnit: pick(xUnits, x.ucum, 0), yUnit: pick(yUnits, y.ucum, 1),
      // R/R(B = 0) only means something over a field axis.
      normalisation: normalisation.kind === 'zero-field' && x.quantity !== 'field' ? { kind: 'none' } : normalisation,
      logX: log.x, logY: log.y,
    }
    : null;
  const key = JSON.stringify(settings);
  // eslint-disable-next-line react-hooks/exhaustive-deps -- `key` stands for every field of settings
  const overlay = useMemo(() => (settings ? prepareOverlay(entries, settings) : null), [entries, key]);

  function update(patch: Partial<OverlaySettings>) {
    if (!active || !x || !y) return;
    if (patch.xKey !== undefined) setPair({ xKey: patch.xKey, yKey: pairs.find((p) => p.xKey === patch.xKey)?.yKey ?? active.yKey });
    if (patch.yKey !== undefined) setPair({ xKey: active.xKey, yKey: patch.yKey });
    if (patch.xUnit !== undefined) setUnitChoice((c) => ({ ...c, [x.ucum ?? '?']: patch.xUnit as string }));
    if (patch.yUnit !== undefined) setUnitChoice((c) => ({ ...c, [y.ucum ?? '?']: patch.yUnit as string }));
    if (patch.normalisation !== undefined) setNormalisation(patch.normalisation);
    if (patch.logX !== undefined || patch.logY !== undefined) setLog((l) => ({ x: patch.logX ?? l.x, y: patch.logY ?? l.y }));
  }

  function setUnitSystem(next: UnitSystem) {
    setSystem(next);
    setUnitChoice({});
  }

  return { settings, overlay, pairs, xUnits, yUnits, update, setUnitSystem };
}

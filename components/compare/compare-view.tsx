'use client';

import dynamic from 'next/dynamic';
import Link from 'next/link';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Notice } from '@/components/ui/notice';
import { MAX_COMPARE_CURVES } from '@/lib/compare/basket-limits';
import type { PreparedOverlay } from '@/lib/compare/prepare-overlay';
import type { CompareEntry, ResolvedBasket, UnavailableEntry } from '@/lib/compare/types';
import {
  addToAccount, clearLocalBasket, emptyAccountBasket, fetchAccountBasket, readLocalBasket, removeFromAccount, removeFromLocalBasket, resolveRefs,
  type AccountBasket,
} from './basket-client';
import { CompareControls } from './compare-controls';
import { CompareLegend } from './compare-legend';
import { ExportActions } from './export-actions';
import { LocalFileDrop } from './local-file-drop';
import { analyseLocalFile, type LocalCurves } from './local-file';
import { useOverlaySettings } from './use-overlay-settings';

// uPlot draws on a canvas: the plot loads in the browser only.
const OverlayPlot = dynamic(() => import('./overlay-plot').then((m) => m.OverlayPlot), {
  ssr: false,
  loading: () => <div className="flex h-[320px] items-center justify-center rounded-md bg-slate-100 text-sm text-slate-600">Loading the plot…</div>,
});

export type CompareViewProps = { signedIn: boolean; initial: AccountBasket | null };

type Phase = { kind: 'loading' } | { kind: 'ready' } | { kind: 'error'; message: string };

function useNarrow(): boolean {
  const [narrow, setNarrow] = useState(false);
  useEffect(() => {
    const query = window.matchMedia('(max-width: 640px)');
    const update = () => setNarrow(query.matches);
    update();
    query.addEventListener('change', update);
    return () => query.removeEventListener('change', update);
  }, []);
  return narrow;
}

/** True when the largest |y| of one curve is over 30 × that of another (one would look flat on a linear axis). */
function spansDecades(overlay: PreparedOverlay): boolean {
  const peaks = overlay.curves.map((c) => c.y.reduce((m, v) => Math.max(m, Math.abs(v)), 0)).filter((v) => v > 0);
  return peaks.length > 1 && Math.max(...peaks) > 30 * Math.min(...peaks);
}

type Loaded = { ok: true; basket: ResolvedBasket; notices: string[] } | { ok: false; message: string };

/** The account's basket (after merging curves this browser kept before sign-in), or the browser's own. */
async function loadBasket(signedIn: boolean): Promise<Loaded> {
  try {
    if (!signedIn) return { ok: true, basket: await resolveRefs(readLocalBasket()), notices: [] };
    const kept = readLocalBasket();
    const notices: string[] = [];
    if (kept.length > 0) {
      // Curves collected before signing in join the account's basket once, then leave the browser.
      const merged = await addToAccount({ items: kept });
      clearLocalBasket();
      const added = merged.items.filter((i) => i.outcome === 'added').length;
      const present = merged.items.length - added;
      const curves = (n: number) => `${n} curve${n === 1 ? '' : 's'}`;
      if (added > 0) notices.push(`${curves(added)} kept in this browser ${added === 1 ? 'was' : 'were'} added to your account's basket.`);
      if (present > 0) notices.push(`${curves(present)} kept in this browser ${present === 1 ? 'was' : 'were'} already in your account's basket.`);
      notices.push(...merged.rejected.map((r) => `Not added: ${r.message}`));
    }
    return { ok: true, basket: await fetchAccountBasket(), notices };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

/** The compare page: the basket's curves overlaid, with pickers, legend with citations, exports and local files. */
export function CompareView({ signedIn, initial }: CompareViewProps) {
  const [phase, setPhase] = useState<Phase>(initial ? { kind: 'ready' } : { kind: 'loading' });
  const [basket, setBasket] = useState<ResolvedBasket>(initial ?? { entries: [], unavailable: [] });
  const [locals, setLocals] = useState<LocalCurves[]>([]);
  const [notices, setNotices] = useState<string[]>([]);
  const [busyKey, setBusyKey] = useState<string | null>(null);
  const [actionError, setActionError] = useState<string | null>(null);
  const localCounter = useRef(0);
  const narrow = useNarrow();

  const apply = useCallback((r: Loaded) => {
    if (!r.ok) return setPhase({ kind: 'error', message: r.message });
    setNotices(r.notices);
    setBasket(r.basket);
    setPhase({ kind: 'ready' });
  }, []);
  const reload = () => {
    setPhase({ kind: 'loading' });
    void loadBasket(signedIn).then(apply);
  };

  useEffect(() => {
    // The server sent the account's basket already, unless this browser holds curves to merge into it.
    if (initial && readLocalBasket().length === 0) return;
    let cancelled = false;
    void loadBasket(signedIn).then((r) => !cancelled && apply(r));
    return () => {
      cancelled = true;
    };
  }, [initial, signedIn, apply]);

  const entries = useMemo<CompareEntry[]>(() => [...basket.entries, ...locals.map((l) => l.entry)], [basket.entries, locals]);
  const tables = useMemo(() => new Map(locals.map((l) => [l.entry.key, l.table])), [locals]);
  const { settings, overlay, pairs, xUnits, yUnits, update, setUnitSystem } = useOverlaySettings(entries);

  async function remove(key: string, work: () => Promise<unknown>, after: () => void) {
    setBusyKey(key);
    setActionError(null);
    try {
      await work();
      after();
    } catch (error) {
      setActionError(error instanceof Error ? error.message : String(error));
    } finally {
      setBusyKey(null);
    }
  }

  const removeEntry = (entry: CompareEntry) => {
    if (!entry.ref) return setLocals((ls) => ls.filter((l) => l.entry.key !== entry.key));
    const ref = entry.ref;
    void remove(entry.key, async () => (signedIn ? removeFromAccount(entry.key) : removeFromLocalBasket(ref)),
      () => setBasket((b) => ({ ...b, entries: b.entries.filter((e) => e.key !== entry.key) })));
  };
  const removeUnavailable = (u: UnavailableEntry) => {
    void remove(u.key, async () => (signedIn ? removeFromAccount(u.key) : removeFromLocalBasket(u.ref)),
      () => setBasket((b) => ({ ...b, unavailable: b.unavailable.filter((x) => x.key !== u.key) })));
  };
  const emptyAll = () => {
    void remove('*', async () => (signedIn ? emptyAccountBasket() : clearLocalBasket()), () => {
      setBasket({ entries: [], unavailable: [] });
      setLocals([]);
    });
  };

  async function addLocal(file: File, onProgress: (f: number) => void): Promise<string | null> {
    if (entries.length >= MAX_COMPARE_CURVES) return `At most ${MAX_COMPARE_CURVES} curves can be overlaid; remove one first.`;
    const key = `local:${++localCounter.current}`;
    const result = await analyseLocalFile(file, key, onProgress);
    if (!result.ok) return result.message;
    setLocals((ls) => [...ls, result.local]);
    return null;
  }

  if (phase.kind === 'loading') {
    return <div role="status" className="flex h-64 items-center justify-center rounded-md border border-slate-200 bg-white text-sm text-slate-600">Loading the curves to compare…</div>;
  }
  if (phase.kind === 'error') {
    return (
      <div className="flex flex-col items-start gap-3">
        <Notice tone="error" title="The compare basket could not be loaded">{phase.message}</Notice>
        <button type="button" onClick={reload} className="rounded-md bg-copper-600 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-700">Try again</button>
      </div>
    );
  }

  const empty = entries.length === 0 && basket.unavailable.length === 0;
  return (
    <div className="flex flex-col gap-5">
      {notices.length > 0 && <Notice tone="success">{notices.map((n) => <p key={n}>{n}</p>)}</Notice>}
      {actionError && <Notice tone="error">{actionError}</Notice>}
      {empty ? (
        <div className="flex flex-col gap-4 rounded-md border border-dashed border-slate-300 bg-white p-6">
          <p className="text-base font-semibold text-slate-900">No curves yet — find some through <Link href="/search" className="text-copper-700 underline underline-offset-2">Search</Link>.</p>
          <p className="max-w-prose text-sm text-slate-700">
            On a dataset page, &ldquo;Add to compare&rdquo; puts its main curve here (up to {MAX_COMPARE_CURVES}). Curves from different labs are
            shown in the same units, can be normalised (for example ρ/ρ(300 K)) and exported as PNG, SVG or CSV with their DOIs.
            {!signedIn && ' Without an account the basket stays in this browser; sign in to keep it.'}
          </p>
          <LocalFileDrop onFile={addLocal} />
        </div>
      ) : (
        <>
          {pairs.length > 0 && settings && (
            <CompareControls pairs={pairs} entryCount={entries.length} settings={settings} xUnits={xUnits} yUnits={yUnits} onChange={update} onUnitSystem={setUnitSystem} />
          )}
          {overlay && settings && spansDecades(overlay) && !settings.logY && settings.normalisation.kind === 'none' && (
            <p className="text-sm text-slate-700">The curves differ in size by more than a factor of 30: try a log y axis or a normalisation to see their shapes.</p>
          )}
          {overlay && overlay.curves.length > 0 ? (
            <OverlayPlot overlay={overlay} logX={settings!.logX} logY={settings!.logY} height={narrow ? 260 : 380} />
          ) : (
            <Notice tone="caution" title="Nothing to draw with these choices">Pick another quantity or normalisation; the list below says why each curve is left out.</Notice>
          )}
          {overlay && settings && <ExportActions overlay={overlay} entries={entries} tables={tables} settings={settings} />}
          <CompareLegend curves={overlay?.curves ?? []} excluded={overlay?.excluded ?? []} unavailable={basket.unavailable}
            onRemove={removeEntry} onRemoveUnavailable={removeUnavailable} busyKey={busyKey} />
          <div className="flex flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
            <div className="sm:flex-1"><LocalFileDrop onFile={addLocal} compact /></div>
            <button type="button" onClick={emptyAll} disabled={busyKey === '*'} className="self-start rounded-md border border-slate-300 bg-white px-3 py-1.5 text-sm text-slate-700 hover:bg-slate-100">
              Empty the basket
            </button>
          </div>
          <p className="text-xs text-slate-600">
            {entries.length} of at most {MAX_COMPARE_CURVES} curves. {signedIn ? 'Your basket is kept with your account.' : 'Your basket is kept in this browser; sign in to keep it with your account.'}
          </p>
        </>
      )}
    </div>
  );
}

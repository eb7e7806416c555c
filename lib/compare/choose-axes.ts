// Which x and y quantity the overlay shows, and which curve of each basket entry matches that choice.
import { axisKey, axisTitle } from './quantities';
import type { CompareEntry, CurveOption } from './types';

export type AxisPair = { xKey: string; yKey: string; entries: number };

const lowerFirst = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);
const pairOf = (o: CurveOption) => `${axisKey(o.x)}\n${axisKey(o.y)}`;

/** The curve of the entry the basket chose (by column names), if it is still in the file's analysis. */
export function chosenOption(entry: CompareEntry): CurveOption | undefined {
  return entry.options.find((o) => o.x.column === entry.chosen.x && o.y.column === entry.chosen.y);
}

/** Every (x, y) quantity pair any entry offers, with how many entries offer it; most widely offered first. */
export function axisPairs(entries: readonly CompareEntry[]): AxisPair[] {
  const count = new Map<string, { entries: number; chosen: number; order: number }>();
  entries.forEach((e) => {
    const chosen = chosenOption(e);
    for (const key of new Set(e.options.map(pairOf))) {
      const c = count.get(key) ?? { entries: 0, chosen: 0, order: count.size };
      c.entries++;
      if (chosen && pairOf(chosen) === key) c.chosen++;
      count.set(key, c);
    }
  });
  return [...count.entries()]
    .sort(([, a], [, b]) => b.entries - a.entries || b.chosen - a.chosen || a.order - b.order)
    .map(([key, c]) => {
      const [xKey, yKey] = key.split('\n');
      return { xKey, yKey, entries: c.entries };
    });
}

/** The entry's curve for the chosen quantities: its own chosen curve when it matches, else the first that does. */
export function optionFor(entry: CompareEntry, xKey: string, yKey: string): CurveOption | undefined {
  const chosen = chosenOption(entry);
  if (chosen && axisKey(chosen.x) === xKey && axisKey(chosen.y) === yKey) return chosen;
  return entry.options.find((o) => axisKey(o.x) === xKey && axisKey(o.y) === yKey);
}

/** Why an entry is left out of the overlay: it has no curve of the chosen quantities (and what it has instead). */
export function missingReason(entry: CompareEntry, xKey: string, yKey: string): string {
  const offered = [...new Set(entry.options.map((o) => `${axisTitle(axisKey(o.y))} against ${lowerFirst(axisTitle(axisKey(o.x)))}`))];
  const wanted = `${axisTitle(yKey)} against ${lowerFirst(axisTitle(xKey))}`;
  return offered.length
    ? `Not shown: this file has no ${wanted} curve. It has: ${offered.join('; ')}.`
    : `Not shown: this file has no curves (its analysis found no x and y columns).`;
}

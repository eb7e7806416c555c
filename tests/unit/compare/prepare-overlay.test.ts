// What the overlay draws: the chosen quantities, units harmonised, normalised, log-filtered with a note.
import { describe, expect, it } from 'vitest';
import { axisPairs, optionFor } from '@/lib/compare/choose-axes';
import { prepareOverlay, scaleCurve, overlayAxes, DISPLAY_POINTS } from '@/lib/compare/prepare-overlay';
import type { CompareEntry } from '@/lib/compare/types';
import { copperFilm, itoFilm, localFile, rhoOfT } from './fixtures';

describe('choice of quantities', () => {
  it('offers the pair most entries have first (ρ(T), 3); of the rest, the one an entry chose (R_s(T)) before R(T)', () => {
    expect(axisPairs([copperFilm, itoFilm, localFile])).toEqual([
      { xKey: 'temperature|K', yKey: 'resistivity|Ohm.m', entries: 3 },
      { xKey: 'temperature|K', yKey: 'sheet-resistance|Ohm/{sq}', entries: 1 },
      { xKey: 'temperature|K', yKey: 'resistance|Ohm', entries: 1 },
    ]);
  });
  it("takes each entry's own chosen curve when it matches, else the first that does", () => {
    expect(optionFor(itoFilm, 'temperature|K', 'resistivity|Ohm.m')?.y.column).toBe('resistivity');
    expect(optionFor(itoFilm, 'temperature|K', 'sheet-resistance|Ohm/{sq}')?.y.column).toBe('Rs');
    expect(optionFor(localFile, 'temperature|K', 'resistance|Ohm')).toBeUndefined();
  });
});

describe('prepareOverlay', () => {
  it('harmonises ρ to µΩ·cm across labs and numbers curves by basket position', () => {
    const o = prepareOverlay([copperFilm, itoFilm], rhoOfT);
    expect(o.axes).toMatchObject({ xTitle: 'T (K)', yTitle: 'ρ (µΩ·cm)' });
    expect(o.curves.map((c) => [c.number, c.style.colour, c.x, c.y.map((v) => Number(v.toPrecision(6)))])).toEqual([
      [1, '#0072B2', [2, 150, 300], [0.55, 1, 1.75]],
      [2, '#D55E00', [10, 300], [410, 400]],
    ]);
    expect(o.curves[0].notes).toEqual(['Drawn from 3 of 4 points (downsampled for display; the CSV export has them all).']);
  });

  it('leaves out a curve that cannot be normalised, with the reason, and keeps the others numbered as in the basket', () => {
    const o = prepareOverlay([localFile, copperFilm], { ...rhoOfT, normalisation: { kind: 'at-x', x: 300 } });
    expect(o.axes.yTitle).toBe('ρ/ρ(300 K)');
    expect(o.excluded).toEqual([{ key: 'local:1', number: 1, entry: localFile, reason: 'Not possible: the curve does not reach 300 K (its T spans 4 K – 250 K).' }]);
    expect(o.curves[0]).toMatchObject({ number: 2, reference: 1.75e-8, x: [2, 150, 300] });
    expect(o.curves[0].y.map((v) => Number(v.toPrecision(6)))).toEqual([0.314286, 0.571429, 1]);
  });

  it('says why an entry without the chosen quantity is not shown', () => {
    const o = prepareOverlay([localFile], { ...rhoOfT, yKey: 'sheet-resistance|Ohm/{sq}', yUnit: 'Ohm/{sq}' });
    expect(o.excluded[0].reason).toBe('Not shown: this file has no Sheet resistance R_s against temperature T curve. It has: Resistivity ρ against temperature T.');
  });
});

describe('log axes', () => {
  const hall: CompareEntry = {
    ...copperFilm, key: 'hall', chosen: { x: 'B', y: 'Rxy' },
    options: [{
      x: { column: 'B', quantity: 'field', ucum: 'T' }, y: { column: 'Rxy', quantity: 'hall-resistance', ucum: 'Ohm' }, derived: false, sourcePoints: 5,
      points: [[-2, -40], [-1, -20], [0, 0], [1, 20], [2, 40]],
    }],
  };
  const settings = { ...rhoOfT, xKey: 'field|T', yKey: 'hall-resistance|Ohm', xUnit: 'T', yUnit: 'Ohm' };

  it('drops values at or below zero on a log y axis and says how many', () => {
    const o = prepareOverlay([hall], { ...settings, logY: true });
    expect(o.curves[0]).toMatchObject({ x: [1, 2], y: [20, 40], notes: ['3 points at or below zero left out: a log y axis cannot show them.'] });
  });
  it('counts a point once when both axes are log', () => {
    const o = prepareOverlay([hall], { ...settings, logX: true, logY: true });
    expect(o.curves[0].notes).toEqual(['3 points at or below zero left out: log axes cannot show them.']);
  });
  it('excludes a curve with nothing left to draw', () => {
    const negative = { ...hall, options: [{ ...hall.options[0], points: [[1, -1], [2, -2]] as [number, number][], sourcePoints: 2 }] };
    const o = prepareOverlay([negative], { ...settings, logY: true });
    expect(o.curves).toEqual([]);
    expect(o.excluded[0].reason).toBe('2 points at or below zero left out: a log y axis cannot show them.');
  });
  it('scaleCurve keeps everything when the axes are linear (the CSV path)', () => {
    const axes = overlayAxes(settings);
    expect(scaleCurve([-1, 0, 1], [-20, 0, 20], 1, axes, { x: false, y: false })).toEqual({ x: [-1, 0, 1], y: [-20, 0, 20], droppedForLog: 0 });
  });
});

describe('display downsampling', () => {
  it(`draws at most ${DISPLAY_POINTS} points of a long curve (LTTB), keeping both ends`, () => {
    const points = Array.from({ length: 5000 }, (_, i) => [i + 1, Math.sin(i / 50) + 2] as [number, number]);
    const long: CompareEntry = { ...localFile, options: [{ ...localFile.options[0], points, sourcePoints: 5000 }] };
    const o = prepareOverlay([long], { ...rhoOfT, yUnit: 'Ohm.m' });
    expect(o.curves[0].x).toHaveLength(DISPLAY_POINTS);
    expect([o.curves[0].x[0], o.curves[0].x.at(-1)]).toEqual([1, 5000]);
    expect(o.curves[0].notes).toEqual([`Drawn from ${DISPLAY_POINTS} of 5000 points (downsampled for display; the CSV export has them all).`]);
  });
});

// The parts of the basket model that need no services: default curve, quantities, query parsing, JSON streaming.
import { describe, expect, it } from 'vitest';
import { parseCurveRefs } from '@/lib/compare/parse-curve-refs';
import { curveJsonStream } from '@/lib/compare/curve-json-stream';
import { defaultCurveIndex } from '@/lib/compare/default-curve';
import { axisKey, axisTitle, quantityOfAxis } from '@/lib/compare/quantities';
import { AppError } from '@/lib/errors';
import { copperFilm, itoFilm } from './fixtures';

const columns = [{ name: 'Field', quantity: 'field' }, { name: 'Rxx', quantity: 'resistance' }] as const;

describe('quantities', () => {
  it('reads measured axes from the column summary and derived ones from the curve name (|B| is field)', () => {
    const mr = { x: '|Field|', y: 'magnetoresistance', xUcum: 'T', yUcum: '%', sourcePoints: 2, points: [], derived: true };
    expect(quantityOfAxis(mr, 'x', [...columns])).toBe('field');
    expect(quantityOfAxis(mr, 'y', [...columns])).toBe('magnetoresistance');
    expect(quantityOfAxis({ ...mr, y: 'Rxx', derived: false }, 'y', [...columns])).toBe('resistance');
    expect(quantityOfAxis({ ...mr, y: 'Vgate', derived: false }, 'y', [...columns])).toBe('other');
  });
  it('keys axes by quantity and unit, so a column of unknown unit never joins an SI axis', () => {
    expect(axisKey({ column: 'R', quantity: 'resistance', ucum: 'Ohm' })).toBe('resistance|Ohm');
    expect(axisKey({ column: 'R', quantity: 'resistance', ucum: null })).toBe('resistance|?');
    expect(axisTitle('resistance|?')).toBe('Resistance R (unit unknown)');
    expect(axisTitle('other|V2/Hz')).toBe('Other quantity');
  });
});

describe('defaultCurveIndex', () => {
  it('prefers ρ(T) over R(T) and R_s(T)', () => {
    expect(defaultCurveIndex(copperFilm.options)).toBe(1);
    expect(defaultCurveIndex(itoFilm.options)).toBe(1);
    expect(defaultCurveIndex([])).toBe(-1);
  });
});

describe('parseCurveRefs', () => {
  const ref = { versionId: '11111111-1111-4111-8111-111111111111', fileId: 'aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa', x: 'T', y: 'R' };
  it('reads a JSON array of references', () => {
    expect(parseCurveRefs(JSON.stringify([ref]))).toEqual([ref]);
    expect(parseCurveRefs(null)).toEqual([]);
  });
  it.each([
    ['not JSON', '[{', 'The curves parameter must be a JSON array of {versionId, fileId, x, y}.'],
    ['an object', '{}', 'The curves parameter must be a non-empty JSON array.'],
    ['13 curves', JSON.stringify(Array(13).fill(ref)), 'At most 12 curves can be compared at once.'],
    ['x without y', JSON.stringify([{ fileId: ref.fileId, x: 'T' }]), 'A curve reference has errors.'],
    ['a bad id', JSON.stringify([{ versionId: "1' OR 1=1" }]), 'A curve reference has errors.'],
  ])('refuses %s with a 422', (_what, param, message) => {
    let error: unknown;
    try {
      parseCurveRefs(param);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).status).toBe(422);
    expect((error as AppError).message).toBe(message);
  });
});

describe('curveJsonStream', () => {
  it('writes valid JSON in slices with every value', async () => {
    const xs = Float64Array.from({ length: 45 }, (_, i) => i * 0.5);
    const ys = Float64Array.from(xs, (v) => v * 1e-9);
    const body = await new Response(curveJsonStream({ fileId: 'f', x: 'T', y: 'R', xUcum: 'K', yUcum: 'Ohm', points: 45, xs, ys }, 10)).json();
    expect(body).toMatchObject({ fileId: 'f', x: 'T', y: 'R', xUcum: 'K', yUcum: 'Ohm', points: 45 });
    expect(body.xs).toEqual(Array.from(xs));
    expect(body.ys).toEqual(Array.from(ys));
    const empty = await new Response(curveJsonStream({ fileId: 'f', x: 'T', y: 'R', xUcum: null, yUcum: null, points: 0, xs: new Float64Array(), ys: new Float64Array() })).json();
    expect(empty).toMatchObject({ xs: [], ys: [], xUcum: null });
  });
});

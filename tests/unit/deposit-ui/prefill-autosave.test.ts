import { readFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { applySuggestions, suggestionsFrom } from '@/components/deposit/record/prefill';
import { putMetadata } from '@/components/deposit/workspace/put-metadata';
import { clearUnsent, decideUnsent, readUnsent, writeUnsent } from '@/components/deposit/workspace/unsent-store';
import { validateTransportDataset } from '@/lib/schema';
import { bytesFromBuffer } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';
import type { FileSummary } from '@/lib/transport/summary/types';

const FIXTURES = path.resolve(import.meta.dirname, '../../fixtures/transport');
let cu: FileSummary;

beforeAll(async () => {
  cu = await summariseFile(bytesFromBuffer(readFileSync(path.join(FIXTURES, 'cu-wire-rt.csv'))), { fileName: 'cu-wire-rt.csv' });
});

describe('prefill from what the files say', () => {
  it('offers ranges, sweep, quantity, excitation and sample name from the Cu-wire file', () => {
    const s = suggestionsFrom({ title: 'Cu' }, [{ label: 'cu-wire-rt.csv', summary: cu }]);
    const byPath = Object.fromEntries(s.map((x) => [x.path.join('.'), x.value]));
    // cu-wire-rt.csv: T from 2 to 300 K, constant I = 1.000 mA, '# Sample: LCL-Cu-W07', '# Material: copper wire, annealed', cooling sweep of T.
    expect(byPath).toEqual({
      'environment.temperatureRange': { min: 2, max: 300, unit: 'K' },
      'environment.sweepVariable': 'temperature',
      'measurement.quantity': 'resistance',
      'measurement.excitation.currentAmplitude': { value: 1, unit: 'mA' },
      'sample.name': 'LCL-Cu-W07',
      'sample.material': 'copper wire, annealed',
    });
    expect(s.find((x) => x.path.join('.') === 'environment.temperatureRange')).toMatchObject({ field: 'Temperature range', text: '2–300 K', from: 'cu-wire-rt.csv' });
  });

  it('never overwrites what the author wrote, and the filled record passes the draft check', () => {
    const record = { title: 'Cu', sample: { name: 'my name' } };
    const s = suggestionsFrom(record, [{ label: 'cu-wire-rt.csv', summary: cu }]);
    expect(s.some((x) => x.path.join('.') === 'sample.name')).toBe(false);
    const filled = applySuggestions(record, s);
    expect((filled as { sample: { name: string } }).sample.name).toBe('my name');
    expect(validateTransportDataset(filled, { partial: true }).ok).toBe(true);
  });
});

function memoryStorage() {
  const data = new Map<string, string>();
  return { getItem: (k: string) => data.get(k) ?? null, setItem: (k: string, v: string) => void data.set(k, v), removeItem: (k: string) => void data.delete(k) };
}

describe('unsent edits kept in the browser', () => {
  it('round-trips and decides restore / offer / none against the server copy', () => {
    const storage = memoryStorage();
    writeUnsent(storage, 'v1', { record: { title: 'mine' }, editedAt: Date.parse('2026-12-02T10:00:05Z') });
    const kept = readUnsent(storage, 'v1');
    expect(kept).toEqual({ record: { title: 'mine' }, editedAt: Date.parse('2026-12-02T10:00:05Z') });
    expect(decideUnsent(kept, { title: 'server' }, '2026-12-02T10:00:00.000Z')).toBe('restore');
    expect(decideUnsent(kept, { title: 'server' }, '2026-12-02T10:01:00.000Z')).toBe('offer');
    expect(decideUnsent(kept, { title: 'mine' }, '2026-12-02T10:01:00.000Z')).toBe('none');
    clearUnsent(storage, 'v1');
    expect(readUnsent(storage, 'v1')).toBeNull();
    storage.setItem('ohmstead:unsent-metadata:v2', '{not json');
    expect(readUnsent(storage, 'v2')).toBeNull();
  });
});

describe('saving through PUT /api/v1/versions/:id/metadata', () => {
  const answer = (status: number, body: unknown) => async () => new Response(JSON.stringify(body), { status, headers: { 'x-request-id': 'req-1' } });

  it('reads 200 and a 422 that says saved:true as saved, with the field messages', async () => {
    expect(await putMetadata(answer(200, { saved: true, complete: true, errors: [] }), 'v', {})).toEqual({ saved: true, complete: true, fieldErrors: {} });
    const invalid = { error: { code: 'validation_failed', message: 'Saved as draft, but 1 fields need fixing.', details: { saved: true, fieldErrors: { 'sample.geometry.width.value': 'Width must be greater than 0.' } } } };
    expect(await putMetadata(answer(422, invalid), 'v', {})).toEqual({ saved: true, complete: false, fieldErrors: { 'sample.geometry.width.value': 'Width must be greater than 0.' } });
  });

  it('sends the record as the JSON body with PUT', async () => {
    let seen: { url: string; init?: RequestInit } | undefined;
    await putMetadata(async (url, init) => {
      seen = { url, init };
      return new Response('{"saved":true,"complete":false,"errors":[]}', { status: 200 });
    }, 'abc', { title: 'x' });
    expect(seen?.url).toBe('/api/v1/versions/abc/metadata');
    expect(seen?.init?.method).toBe('PUT');
    expect(seen?.init?.body).toBe('{"title":"x"}');
  });

  it('keeps edits and retries on a server fault or no connection; does not retry a refusal', async () => {
    const fault = await putMetadata(answer(503, { error: { code: 'service_unavailable', message: 'x' } }), 'v', {});
    expect(fault).toMatchObject({ saved: false, retry: true, message: expect.stringContaining('reference req-1') });
    const offline = await putMetadata(async () => { throw new TypeError('Failed to fetch'); }, 'v', {});
    expect(offline).toMatchObject({ saved: false, retry: true });
    const gone = await putMetadata(answer(403, { error: { code: 'forbidden', message: 'Only drafts can be edited.' } }), 'v', {});
    expect(gone).toEqual({ saved: false, retry: false, message: 'Only drafts can be edited.' });
    expect(await putMetadata(answer(401, {}), 'v', {})).toMatchObject({ saved: false, retry: false, message: expect.stringContaining('Sign in again') });
  });
});

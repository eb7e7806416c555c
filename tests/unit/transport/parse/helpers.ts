import { readFileSync } from 'node:fs';
import path from 'node:path';
import { parseTransportText, TransportParseError, type ParsedTable } from '@/lib/transport/parse';

export const FIXTURES = path.resolve(import.meta.dirname, '../../../fixtures/transport');
export const fixture = (name: string) => readFileSync(path.join(FIXTURES, name));
export const parseFixture = (name: string) => parseTransportText(fixture(name));
export const column = (t: ParsedTable, name: string) => {
  const c = t.columns.find((col) => col.name === name);
  if (!c) throw new Error(`no column ${name} in ${t.columns.map((x) => x.name).join(', ')}`);
  return c;
};

/** The TransportParseError a parse rejects with (fails the test when it resolves). */
export async function parseError(data: Uint8Array | string, options = {}): Promise<TransportParseError> {
  try {
    await parseTransportText(data, options);
  } catch (e) {
    if (e instanceof TransportParseError) return e;
    throw e;
  }
  throw new Error('expected a TransportParseError');
}

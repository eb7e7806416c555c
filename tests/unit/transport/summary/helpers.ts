import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { TransportDatasetDraft } from '@/lib/schema';
import { bytesFromBuffer } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';
import type { FileSummary } from '@/lib/transport/summary';

export const FIXTURES = path.resolve(import.meta.dirname, '../../../fixtures/transport');
export const meta = (name: string) => JSON.parse(readFileSync(path.join(FIXTURES, name), 'utf8')) as TransportDatasetDraft;

export function summariseFixture(file: string, metadata?: TransportDatasetDraft): Promise<FileSummary> {
  return summariseFile(bytesFromBuffer(readFileSync(path.join(FIXTURES, file))), { metadata, fileName: file });
}

export function derivedValue(s: FileSummary, key: string): number {
  const d = s.derived.find((v) => v.key === key);
  if (!d) throw new Error(`no derived ${key}; have ${s.derived.map((v) => v.key).join(', ')}`);
  return d.value;
}

/** |a − b| ≤ rel·|b|, printing both on failure. */
export function closeTo(actual: number, expected: number, rel: number): boolean {
  return Math.abs(actual - expected) <= rel * Math.abs(expected);
}

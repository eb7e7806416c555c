import { demoDeposits, type DemoDeposit } from '@/db/seeds/demo-data';
import { bytesFromBuffer, parseTransportTable, type ParsedTable } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';
import type { FileSummary } from '@/lib/transport/summary';

export type Analysed = { deposit: DemoDeposit; file: DemoDeposit['files'][number]; summary: FileSummary; table: ParsedTable };

let cache: Promise<Analysed[]> | undefined;

/** Every demo file summarised with its deposit's record (as the deposit worker will), and parsed; computed once. */
export function analysedDemoFiles(): Promise<Analysed[]> {
  cache ??= (async () => {
    const out: Analysed[] = [];
    for (const deposit of demoDeposits()) {
      for (const file of deposit.files) {
        const summary = await summariseFile(bytesFromBuffer(file.bytes), { metadata: deposit.record, fileName: file.name });
        const table = await parseTransportTable(bytesFromBuffer(file.bytes));
        out.push({ deposit, file, summary, table });
      }
    }
    return out;
  })();
  return cache;
}

export async function analysed(fileName: string): Promise<Analysed> {
  const found = (await analysedDemoFiles()).find((a) => a.file.name === fileName);
  if (!found) throw new Error(`no demo file ${fileName}`);
  return found;
}

export function derivedValue(s: FileSummary, key: string): number {
  const d = s.derived.find((v) => v.key === key);
  if (!d) throw new Error(`no derived ${key}; have ${s.derived.map((v) => v.key).join(', ')}`);
  return d.value;
}

export function columnValues(t: ParsedTable, name: string): Float64Array {
  const c = t.columns.find((col) => col.name === name);
  if (!c) throw new Error(`no column ${name}`);
  return c.values;
}

export const relativeError = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

// The DOI fake's state: one JSON file under <data>/doi, rewritten atomically after each change so a restart keeps it.
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { DoiRecord } from './doi-model';

export class DoiStore {
  private readonly records = new Map<string, DoiRecord>();
  private readonly file: string;

  constructor(dir: string) {
    mkdirSync(dir, { recursive: true });
    this.file = path.join(dir, 'dois.json');
    try {
      const saved = JSON.parse(readFileSync(this.file, 'utf8')) as { dois: DoiRecord[] };
      for (const r of saved.dois) this.records.set(r.doi, r);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw error;
    }
  }

  get(doi: string): DoiRecord | undefined {
    return this.records.get(doi);
  }

  all(): DoiRecord[] {
    return [...this.records.values()].sort((a, b) => a.created.localeCompare(b.created) || a.doi.localeCompare(b.doi));
  }

  put(record: DoiRecord): void {
    this.records.set(record.doi, record);
    this.save();
  }

  delete(doi: string): void {
    this.records.delete(doi);
    this.save();
  }

  // Synchronous on purpose: each request's change is on disk before its response is sent.
  private save(): void {
    const tmp = `${this.file}.${process.pid}.tmp`;
    writeFileSync(tmp, JSON.stringify({ dois: this.all() }, null, 2) + '\n');
    renameSync(tmp, this.file);
  }
}

import { describe, expect, it } from 'vitest';
import demo from '@/db/seeds/demo-accounts.json';
import { demoDeposits } from '@/db/seeds/demo-data';
import { validateTransportDataset } from '@/lib/schema';
import { bytesFromBuffer } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';
import { analysedDemoFiles } from './helpers';

const UCUM_TO_SI: Record<string, string> = { K: 'K', s: 's', Ohm: 'Ohm', mOhm: 'Ohm', uA: 'A', uV: 'V', T: 'T' };

describe('demoDeposits()', () => {
  const deposits = demoDeposits();

  it('gives the five scenario deposits across the three invented labs', () => {
    expect(deposits.map((d) => [d.groupSlug, d.files.length, d.publish ?? false])).toEqual([
      ['larkspur-cryogenic', 1, true],
      ['larkspur-cryogenic', 1, false],
      ['tidewater-thin-films', 1, true],
      ['cobalt-ridge-magnetotransport', 5, true],
      ['cobalt-ridge-magnetotransport', 1, true],
    ]);
  });

  it('every record passes the full (not draft) schema validation, and its title is the deposit title', () => {
    for (const d of deposits) {
      expect(validateTransportDataset(d.record), d.title).toEqual({ ok: true, value: d.record });
      expect(d.record.title).toBe(d.title);
      expect(d.record.description).toMatch(/Invented demo data of the fictional Meridian Transport Consortium; not a real measurement\.$/);
    }
  });

  it('authors and creators are demo accounts who may deposit in that group', () => {
    const memberOf = (email: string) => [
      ...demo.accounts.filter((a) => a.email === email && a.group).map((a) => a.group),
      ...demo.extraMemberships.filter((m) => m.email === email).map((m) => m.group),
    ];
    const names = new Set(demo.accounts.map((a) => a.name));
    for (const d of deposits) {
      expect(memberOf(d.authorEmail)).toContain(d.groupSlug);
      for (const c of d.record.creators) expect(names.has(c.name), c.name).toBe(true);
    }
  });

  it('is deterministic: the same bytes on every call (seeded noise)', () => {
    const again = demoDeposits();
    expect(again.map((d) => d.files.map((f) => Buffer.from(f.bytes).toString('base64')))).toEqual(deposits.map((d) => d.files.map((f) => Buffer.from(f.bytes).toString('base64'))));
  });

  it('file names are unique, plain names (no path separators) with a role', () => {
    const names = deposits.flatMap((d) => d.files.map((f) => f.name));
    expect(new Set(names).size).toBe(names.length);
    for (const d of deposits) for (const f of d.files) expect([f.name, f.role]).toEqual([expect.stringMatching(/^[\w.-]+$/), 'raw']);
  });
});

describe('every demo file through summariseFile with its record', () => {
  it('has the record’s columns, in the file’s order, mapped as the record says and converted to SI', async () => {
    for (const { deposit, file, summary } of await analysedDemoFiles()) {
      const expected = deposit.record.columns?.map((c) => [c.name, c.quantity, c.unit, UCUM_TO_SI[c.unit], c.role]);
      expect(summary.columns.map((c) => [c.name, c.quantity, c.ucum, c.siUcum, c.role]), file.name).toEqual(expected);
      expect(summary.columns.every((c) => c.converted && c.nanCount === 0 && c.range !== null), file.name).toBe(true);
    }
  });

  it('reads every line as a data row, with no warning but the record’s column mapping', async () => {
    for (const { file, summary } of await analysedDemoFiles()) {
      const text = new TextDecoder('latin1').decode(file.bytes);
      const lines = text.split(/\r?\n/).filter((l) => l !== '');
      const commentsAndHeader = lines.findIndex((l) => /^\s*[-+]?\d/.test(l));
      expect(summary.rowCount, file.name).toBe(lines.length - commentsAndHeader);
      expect(new Set(summary.warnings.map((w) => w.code)), file.name).toEqual(new Set(['column-override']));
    }
  });

  it('the headers alone already map to the same quantities (an author would not need to correct them)', async () => {
    for (const { file, summary } of await analysedDemoFiles()) {
      const bare = await summariseFile(bytesFromBuffer(file.bytes));
      expect(bare.columns.map((c) => [c.name, c.quantity, c.ucum]), file.name).toEqual(summary.columns.map((c) => [c.name, c.quantity, c.ucum]));
    }
  });

  it('raises no quality flag except the Nb wire’s info that a superconductor reads noise around zero', async () => {
    const flags = (await analysedDemoFiles()).filter((a) => a.summary.quality.length > 0).map((a) => [a.file.name, a.summary.quality.map((q) => [q.code, q.severity])]);
    expect(flags).toEqual([['LCL-Nb-W03_transition_cooling.csv', [['negative-four-wire-resistance', 'info']]]]);
  });
});

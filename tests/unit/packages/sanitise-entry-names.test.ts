// File names as authors give them → zip entry paths under data/ that are safe and distinct (common practice:
// the APPNOTE forbids drive letters and leading "/", Windows forbids <>:"|?* and device names, macOS folds case).
import { describe, expect, it } from 'vitest';
import { sanitiseEntryName, sanitiseEntryNames } from '@/lib/packages/sanitise-entry-names';

describe('sanitiseEntryName', () => {
  it.each([
    ['rxx_1p8K.csv', 'rxx_1p8K.csv'],
    ['../../etc/passwd', 'etc/passwd'],
    ['/abs/run.csv', 'abs/run.csv'],
    ['C:\\Users\\lab\\run.csv', 'C_/Users/lab/run.csv'],
    ['raw\\2026\\run.csv', 'raw/2026/run.csv'],
    ['line\nbreak\r.csv', 'line_break_.csv'],
    ['tab\there\u0000.csv', 'tab_here_.csv'],
    ['what?<R>|"x":*.dat', 'what__R___x___.dat'],
    ['trailing dots... ', 'trailing dots'],
    ['con.txt', '_con.txt'],
    ['LPT1', '_LPT1'],
    ['..', 'file'],
    ['  ', 'file'],
    ['100%.csv', '100%.csv'],
    ['ρ(T) µΩ·cm.dat', 'ρ(T) µΩ·cm.dat'],
  ])('%j → %j', (name, expected) => expect(sanitiseEntryName(name)).toBe(expected));

  it('keeps a segment within 255 UTF-8 bytes and keeps its extension', () => {
    const long = `${'Ω'.repeat(200)}.csv`; // 2 bytes per Ω
    const out = sanitiseEntryName(long);
    expect(Buffer.byteLength(out)).toBeLessThanOrEqual(255);
    expect(out).toBe(`${'Ω'.repeat(125)}.csv`);
  });

  it('writes composed (NFC) forms so macOS and Linux agree', () => {
    expect(sanitiseEntryName('Me\u0301ssbauer.csv')).toBe('M\u00e9ssbauer.csv');
  });
});

describe('sanitiseEntryNames', () => {
  it('suffixes later duplicates, ignoring case, before the extension', () => {
    expect(sanitiseEntryNames(['run.csv', 'Run.csv', 'run.csv', 'run-2.csv', '../run.csv', 'notes'])).toEqual([
      'run.csv',
      'Run-2.csv',
      'run-3.csv',
      'run-2-2.csv',
      'run-4.csv',
      'notes',
    ]);
  });

  it('never makes a path both a file and a folder', () => {
    expect(sanitiseEntryNames(['raw', 'raw/a.csv', 'sub/b.csv', 'sub'])).toEqual(['raw', 'raw_a.csv', 'sub/b.csv', 'sub-2']);
  });
});

import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { create } from 'xmlbuilder2';

// Oracle: the official DataCite Metadata Schema 4.7 XSD (schema DOI 10.14454/28a4-kd32), read in place.
export const ORACLE_DIR = path.resolve(import.meta.dirname, '../../../../shared/oracles/datacite-kernel-4.7');
export const XSD = path.join(ORACLE_DIR, 'metadata.xsd');
export const NS = 'http://datacite.org/schema/kernel-4';

function xmllint(args: string[], xml: string): { status: number | null; stdout: string; stderr: string } {
  const dir = mkdtempSync(path.join(tmpdir(), 'ohm-datacite-'));
  try {
    const file = path.join(dir, 'record.xml');
    writeFileSync(file, xml, 'utf8');
    const run = spawnSync('xmllint', [...args, file], { encoding: 'utf8', timeout: 20_000 });
    if (run.error) throw new Error(`xmllint could not run (Debian package libxml2-utils): ${run.error.message}`);
    return { status: run.status, stdout: run.stdout, stderr: run.stderr };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** libxml2's verdict on `xml` against the 4.7 XSD: ok only when xmllint exits 0 and says "validates". */
export function validateWithXsd(xml: string): { ok: boolean; messages: string } {
  const run = xmllint(['--noout', '--nonet', '--schema', XSD], xml);
  return { ok: run.status === 0 && /validates/.test(run.stderr), messages: run.stderr.trim() };
}

/** Text of an XPath expression as libxml2 (a second, independent parser) reads it. */
export function xpathString(xml: string, expression: string): string {
  const run = xmllint(['--xpath', `string(${expression})`], xml);
  if (run.status !== 0) throw new Error(run.stderr);
  return run.stdout.replace(/\n$/, ''); // xmllint ends its answer with a newline
}

/** The DataCite elements named `local` in document order, parsed with xmlbuilder2's DOM. */
export function elements(xml: string, local: string): Element[] {
  const doc = create(xml).node as unknown as Document;
  const list = doc.getElementsByTagNameNS(NS, local);
  return Array.from({ length: list.length }, (_, i) => list.item(i) as Element);
}

export const texts = (xml: string, local: string) => elements(xml, local).map((e) => e.textContent);
export const attr = (xml: string, local: string, name: string) => elements(xml, local).map((e) => e.getAttribute(name));

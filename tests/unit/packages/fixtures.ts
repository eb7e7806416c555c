// Package inputs over the DataCite fixtures (invented Meridian Transport Consortium data).
import { createHash } from 'node:crypto';
import type { PackageFile, PackageInput } from '@/lib/packages/types';
import { fullInput } from '../datacite/fixtures';

export const sha256Hex = (data: string | Buffer) => createHash('sha256').update(data).digest('hex');

/** A payload file whose bytes the test holds; storageKey is where an integration test puts them. */
export type FileWithBytes = PackageFile & { bytes: Buffer };

export function fileWithBytes(name: string, content: string | Buffer, storageKey = `test/${name}`, mediaType = 'text/csv'): FileWithBytes {
  const bytes = Buffer.isBuffer(content) ? content : Buffer.from(content, 'utf8');
  return { name, sizeBytes: bytes.length, sha256: sha256Hex(bytes), storageKey, mediaType, bytes };
}

export const RXX_CSV = '# cooldown 2, flake F12\nB (T),Rxx (Ohm),T (K)\n-9.0,101.25,1.80\n0.0,98.50,1.80\n9.0,101.27,1.80\n';
export const RXY_CSV = 'B (T),Rxy (Ohm),T (K)\n-9.0,-3.10,1.80\n9.0,3.11,1.80\n';

export function packageInput(files: PackageFile[], extra: Partial<PackageInput> = {}): PackageInput {
  const metadata: Partial<ReturnType<typeof fullInput>> = fullInput();
  delete metadata.files;
  delete metadata.kind;
  return { metadata: metadata as PackageInput['metadata'], files, baggingDate: new Date('2026-12-02T10:00:00Z'), ...extra };
}

/** Every string that would identify the depositors in fullInput(): names, ORCID iDs, affiliations, group, RORs. */
export function identifyingStrings(input: PackageInput): string[] {
  const r = input.metadata.record;
  const out = new Set<string>([input.metadata.group.name, ...(input.metadata.group.rorId ? [input.metadata.group.rorId] : [])]);
  for (const c of r.creators) {
    out.add(c.name);
    for (const part of c.name.split(/[\s,]+/)) if (part.length > 3) out.add(part);
    if (c.orcid) out.add(c.orcid.replace(/^https?:\/\/orcid\.org\//, ''));
    for (const a of c.affiliation ?? []) {
      out.add(a.name);
      if (a.rorId) out.add(a.rorId);
    }
  }
  return [...out];
}

/** Bitwise CRC-32 (ISO-HDLC, reflected polynomial 0xEDB88320) as the CRC catalogue defines it; check value of
 * "123456789" is 0xCBF43926. Independent of zlib and of the crc-32 package. */
export function referenceCrc32(bytes: Uint8Array, seed = 0): number {
  let c = ~seed >>> 0;
  for (const b of bytes) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return ~c >>> 0;
}

// Parsers for BagIt 1.0 tag files (RFC 8493 §2.1.1, §2.1.3, §2.2.1–§2.2.3). Pure: text in, entries and problems out.
import { decodeBagPath, hasBarePercent, showPath } from './bag-paths';

/** Hex digest length of each algorithm a manifest may name (RFC 8493 §2.4 lists md5, sha1, sha256, sha512). */
export const DIGEST_HEX_LENGTH: Readonly<Record<string, number>> = { md5: 32, sha1: 40, sha224: 56, sha256: 64, sha384: 96, sha512: 128 };

export type Parsed<T> = T & { problems: string[]; warnings: string[] };
export type BagitDeclaration = Parsed<{ version?: string; encoding?: string }>;
export type TagElement = { label: string; value: string };
export type ManifestEntries = Parsed<{ entries: Map<string, string> }>;
export type FetchEntry = { url: string; lengthBytes?: number; path: string };

/** Lines end with LF, CR or CRLF (RFC 8493 §2.1); a final terminator does not start another line. */
export function splitLines(text: string): string[] {
  const lines = text.split(/\r\n|\r|\n/);
  if (lines.length > 1 && lines[lines.length - 1] === '') lines.pop();
  return lines;
}

/** Decodes a tag file in the bag's declared encoding; undefined when the bytes are not valid in it. */
export function decodeTagText(bytes: Uint8Array, encoding: string): string | undefined {
  try {
    return new TextDecoder(encoding, { fatal: true }).decode(bytes);
  } catch {
    return undefined;
  }
}

/** bagit.txt: exactly two lines, "BagIt-Version: M.N" then "Tag-File-Character-Encoding: ENCODING", UTF-8 without BOM. */
export function parseBagitTxt(bytes: Uint8Array): BagitDeclaration {
  const out: BagitDeclaration = { problems: [], warnings: [] };
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) out.problems.push('bagit.txt: starts with a byte-order mark, which RFC 8493 §2.1.1 forbids');
  const text = decodeTagText(bytes, 'utf-8');
  if (text === undefined) {
    out.problems.push('bagit.txt: is not valid UTF-8');
    return out;
  }
  const lines = splitLines(text.replace(/^\uFEFF/, ''));
  if (lines.length !== 2) out.problems.push(`bagit.txt: must have exactly two lines, has ${lines.length}`);
  const version = /^BagIt-Version:[ \t](\d+\.\d+)$/.exec(lines[0] ?? '');
  if (version) out.version = version[1];
  else out.problems.push(`bagit.txt: line 1 must be "BagIt-Version: M.N", found ${JSON.stringify(lines[0] ?? '')}`);
  const encoding = /^Tag-File-Character-Encoding:[ \t](\S+)$/.exec(lines[1] ?? '');
  if (encoding) out.encoding = encoding[1];
  else out.problems.push(`bagit.txt: line 2 must be "Tag-File-Character-Encoding: ENCODING", found ${JSON.stringify(lines[1] ?? '')}`);
  if (out.version && out.version !== '1.0') out.warnings.push(`bagit.txt: BagIt-Version ${out.version}; checked by the rules of version 1.0`);
  return out;
}

/** "Label: value" elements (bag-info.txt); a line that starts with a space or tab continues the element above. */
export function parseTagElements(text: string, fileName: string): Parsed<{ elements: TagElement[] }> {
  const out: Parsed<{ elements: TagElement[] }> = { elements: [], problems: [], warnings: [] };
  splitLines(text).forEach((line, i) => {
    const where = `${fileName}: line ${i + 1}`;
    if (line === '') return void out.warnings.push(`${where} is empty`);
    const last = out.elements[out.elements.length - 1];
    if (/^[ \t]/.test(line)) {
      if (last) last.value = `${last.value} ${line.trim()}`;
      else out.problems.push(`${where} is indented but no element comes before it`);
      return;
    }
    const m = /^([^:]*):(?:[ \t](.*))?$/.exec(line);
    if (!m) return void out.problems.push(`${where} is not "Label: value": ${JSON.stringify(line)}`);
    const label = m[1]!;
    if (label === '' || /^[ \t]|[ \t]$/.test(label)) return void out.problems.push(`${where}: the label ${JSON.stringify(label)} is empty or starts or ends with whitespace`);
    out.elements.push({ label, value: m[2] ?? '' });
  });
  return out;
}

/** A payload or tag manifest: "checksum filepath" lines; every path once (the conformance suite rejects repeats). */
export function parseManifest(text: string, fileName: string, algorithm: string): ManifestEntries {
  const out: ManifestEntries = { entries: new Map(), problems: [], warnings: [] };
  const hexLength = DIGEST_HEX_LENGTH[algorithm];
  splitLines(text).forEach((line, i) => {
    const where = `${fileName}: line ${i + 1}`;
    if (line === '') return void out.warnings.push(`${where} is empty`);
    const m = /^([0-9A-Fa-f]+)[ \t]+(.+)$/.exec(line);
    if (!m) return void out.problems.push(`${where} is not "checksum filepath": ${JSON.stringify(line)}`);
    const digest = m[1]!.toLowerCase();
    const encoded = m[2]!;
    if (hexLength !== undefined && digest.length !== hexLength)
      out.problems.push(`${where}: a ${algorithm} digest has ${hexLength} hex digits, found ${digest.length}`);
    if (hasBarePercent(encoded)) out.warnings.push(`${where}: "%" not written as %25 in ${showPath(encoded)}`);
    const path = decodeBagPath(encoded);
    const earlier = out.entries.get(path);
    if (earlier === undefined) out.entries.set(path, digest);
    else if (earlier === digest) out.problems.push(`${fileName}: lists ${showPath(path)} twice`);
    else out.problems.push(`${fileName}: lists ${showPath(path)} twice with different digests`);
  });
  return out;
}

/** fetch.txt: "url length filepath" lines, length in octets or "-" (RFC 8493 §2.2.3). */
export function parseFetch(text: string): Parsed<{ entries: FetchEntry[] }> {
  const out: Parsed<{ entries: FetchEntry[] }> = { entries: [], problems: [], warnings: [] };
  splitLines(text).forEach((line, i) => {
    const where = `fetch.txt: line ${i + 1}`;
    if (line === '') return void out.warnings.push(`${where} is empty`);
    const m = /^(\S+)[ \t]+(\d+|-)[ \t]+(.+)$/.exec(line);
    if (!m) return void out.problems.push(`${where} is not "url length filepath": ${JSON.stringify(line)}`);
    if (!/^[A-Za-z][A-Za-z0-9+.-]*:/.test(m[1]!) || !URL.canParse(m[1]!)) out.problems.push(`${where}: ${JSON.stringify(m[1])} is not an absolute URL`);
    out.entries.push({ url: m[1]!, lengthBytes: m[2] === '-' ? undefined : Number(m[2]), path: decodeBagPath(m[3]!) });
  });
  return out;
}

// The BagIt 1.0 layout of a version's package (RFC 8493): tag files built in memory, payload mapped to storage keys.
import { createHash } from 'node:crypto';
import { encodeBagPath } from '@/lib/bagit/bag-paths';
import { formatPayloadOxum } from '@/lib/bagit/payload-oxum';
import { formatCitation } from '@/lib/citation';
import { bareDoi, buildDataCiteJson, doiUrl, isoDay, renderDataCiteXml } from '@/lib/datacite';
import { formatBytes } from '@/lib/format/bytes';
import { anonymiseDataCite, recordForCitation } from './anonymise';
import { buildCitationCff } from './build-citation-cff';
import { buildPackageRecord } from './build-package-record';
import { buildReadme } from './build-readme';
import { sanitiseEntryName, sanitiseEntryNames } from './sanitise-entry-names';
import type { BagPlan, PackageInput, PayloadEntry, TagEntry } from './types';

export const BAG_SOFTWARE_AGENT = 'Ohmstead';
const sha256 = (data: Buffer) => createHash('sha256').update(data).digest('hex');
/** bag-info.txt values are one line each (RFC 8493 §2.2.2 allows folding, which readers handle unevenly). */
const oneLine = (text: string) => text.replace(/\s+/g, ' ').trim();

function assertFiles(input: PackageInput): void {
  for (const f of input.files) {
    if (!/^[0-9a-f]{64}$/.test(f.sha256)) throw new RangeError(`file ${JSON.stringify(f.name)}: sha256 must be 64 lower-case hex digits`);
    if (!Number.isSafeInteger(f.sizeBytes) || f.sizeBytes < 0) throw new RangeError(`file ${JSON.stringify(f.name)}: sizeBytes must be a non-negative integer`);
  }
}

/** Default top-level folder (and zip) name: "ohmstead-" and the version DOI's suffix, e.g. "ohmstead-ohm.k7p2-v2". */
export function defaultBagName(doi: string): string {
  const suffix = bareDoi(doi).split('/').slice(1).join('/') || bareDoi(doi);
  return `ohmstead-${suffix.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^[.-]+/, '')}`.slice(0, 120);
}

function dataCiteXml(input: PackageInput, payload: PayloadEntry[]): string {
  const files = payload.map((p) => ({ name: p.path.slice('data/'.length), sizeBytes: p.file.sizeBytes, format: p.file.mediaType ?? 'application/octet-stream', sha256: p.file.sha256 }));
  const attributes = buildDataCiteJson({ ...input.metadata, kind: 'version', files });
  return renderDataCiteXml(input.anonymous ? anonymiseDataCite(attributes) : attributes);
}

function bagInfo(input: PackageInput, payloadBytes: number, payloadCount: number, bagBytes: number, baggingDate: Date): string {
  const m = input.metadata;
  const elements: [string, string][] = [
    ...(input.anonymous ? [] : ([['Source-Organization', m.group.name]] as [string, string][])),
    ['External-Identifier', doiUrl(m.doi)],
    ['External-Description', `${m.record.title}. Electrical transport dataset, version ${m.versionNumber}, ${payloadCount} ${payloadCount === 1 ? 'file' : 'files'}.`],
    ['Bagging-Date', isoDay(baggingDate)],
    ['Payload-Oxum', formatPayloadOxum(payloadBytes, payloadCount)],
    ['Bag-Size', formatBytes(bagBytes)],
    ['Bag-Software-Agent', BAG_SOFTWARE_AGENT],
  ];
  return elements.map(([label, value]) => `${label}: ${oneLine(value)}\n`).join('');
}

/** Plans the bag of one version: every tag file's bytes and every payload file's path (sanitised, distinct). */
export function planBag(input: PackageInput): BagPlan {
  assertFiles(input);
  const anonymous = input.anonymous === true;
  const baggingDate = input.baggingDate ?? new Date();
  const paths = sanitiseEntryNames(input.files.map((f) => f.name));
  const payload: PayloadEntry[] = input.files.map((file, i) => ({ path: `data/${paths[i]}`, file }));
  const payloadBytes = payload.reduce((sum, p) => sum + p.file.sizeBytes, 0);
  const citation = { ...input.metadata, kind: 'version' as const, record: recordForCitation(input.metadata.record, anonymous) };
  const text = (path: string, content: string): TagEntry => ({ path, content: Buffer.from(content, 'utf8') });

  const described: TagEntry[] = [
    text('manifest-sha256.txt', payload.map((p) => `${p.file.sha256}  ${encodeBagPath(p.path)}\n`).join('')),
    text('README.md', buildReadme(input, payload)),
    text('CITATION.cff', buildCitationCff(input)),
    text('citation.bib', formatCitation(citation, 'bibtex')),
    text('metadata/ohmstead-record.json', buildPackageRecord(input, payload)),
    text('metadata/datacite.xml', dataCiteXml(input, payload)),
  ];
  const declaration = text('bagit.txt', 'BagIt-Version: 1.0\nTag-File-Character-Encoding: UTF-8\n');
  const approxBagBytes = payloadBytes + [declaration, ...described].reduce((sum, t) => sum + t.content.length, 0);
  const info = text('bag-info.txt', bagInfo(input, payloadBytes, payload.length, approxBagBytes, baggingDate));
  const tagged = [declaration, info, ...described];
  const tagManifest = text('tagmanifest-sha256.txt', tagged.map((t) => `${sha256(t.content)}  ${encodeBagPath(t.path)}\n`).join(''));
  return {
    bagName: input.bagName ? sanitiseEntryName(input.bagName).replace(/\//g, '-') : defaultBagName(input.metadata.doi),
    tagFiles: [...tagged, tagManifest],
    payload,
    payloadBytes,
    baggingDate,
  };
}

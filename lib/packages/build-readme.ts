// README.md of a package: what the dataset is, its columns and units, its files, how to cite and check it.
import { formatCitation } from '@/lib/citation';
import { bareDoi, describeTechnicalInfo, doiUrl, isoDay, orcidUrl, spdxLicence } from '@/lib/datacite';
import { formatBytes } from '@/lib/format/bytes';
import type { Column, TransportDataset } from '@/lib/schema';
import { labelFromUcum } from '@/lib/transport/units/label';
import { recordForCitation } from './anonymise';
import type { PackageInput, PayloadEntry } from './types';

const ROLE: Record<Column['role'], string> = { x: 'independent (x)', y: 'measured (y)', aux: 'auxiliary' };

/** A Markdown table cell: one line, "|" escaped. */
const cell = (text: string) => text.replace(/[\r\n]+/g, ' ').replace(/\|/g, '\\|');
const code = (text: string) => (text.includes('`') ? `\`\` ${cell(text)} \`\`` : `\`${cell(text)}\``);

const COLUMN_WORDS: Partial<Record<Column['quantity'], string>> = {
  field: 'magnetic field',
  'hall-resistance': 'Hall resistance',
  'hall-resistivity': 'Hall resistivity',
  'lock-in-x': 'lock-in X (in phase)',
  'lock-in-y': 'lock-in Y (quadrature)',
  'lock-in-r': 'lock-in R (magnitude)',
  'lock-in-phase': 'lock-in phase',
};
const columnLabel = (q: Column['quantity']) => COLUMN_WORDS[q] ?? q.replace(/-/g, ' ');

function peopleSection(input: PackageInput): string[] {
  if (input.anonymous) return ['Creators, their affiliations and the depositing group are withheld in this anonymous review copy.'];
  const creators = input.metadata.record.creators.map((c) => {
    const affiliations = (c.affiliation ?? []).map((a) => a.name).join('; ');
    return `- ${c.name}${affiliations ? ` (${affiliations})` : ''}${c.orcid ? `, ${orcidUrl(c.orcid)}` : ''}`;
  });
  return ['Creators:', '', ...creators, '', `Deposited by: ${input.metadata.group.name}`];
}

function columnsSection(record: TransportDataset): string[] {
  if (!record.columns?.length) return ['The depositors did not describe the columns; see the files\' own header lines.'];
  return [
    '| Column | Quantity | Unit | UCUM code | Role |',
    '| --- | --- | --- | --- | --- |',
    ...record.columns.map((c) => `| ${cell(c.name)} | ${cell(columnLabel(c.quantity))} | ${cell(labelFromUcum(c.unit))} | ${code(c.unit)} | ${ROLE[c.role]} |`),
    '',
    'Units are given as UCUM codes (Unified Code for Units of Measure); the labels beside them are for reading.',
  ];
}

function filesSection(payload: PayloadEntry[]): string[] {
  const renamed = payload.filter((p) => p.file.name !== p.path.slice('data/'.length));
  return [
    '| Path | Size | SHA-256 |',
    '| --- | ---: | --- |',
    ...payload.map((p) => `| ${code(p.path)} | ${formatBytes(p.file.sizeBytes)} | ${code(p.file.sha256)} |`),
    ...(renamed.length
      ? ['', 'Renamed so that every system can unpack them (deposited name → path):', '', ...renamed.map((p) => `- ${code(p.file.name)} → ${code(p.path)}`)]
      : []),
  ];
}

/** The README.md text of a package. */
export function buildReadme(input: PackageInput, payload: PayloadEntry[]): string {
  const m = input.metadata;
  const doi = bareDoi(m.doi);
  const citation = { ...m, kind: 'version' as const, record: recordForCitation(m.record, input.anonymous === true) };
  const licence = m.record.license ? spdxLicence(m.record.license) : undefined;
  const review = input.reviewCopy || input.anonymous;
  const lines = [
    `# ${m.record.title.replace(/[\r\n]+/g, ' ')}`,
    '',
    ...(review ? ['> **Confidential review copy.** Shared through a private reviewer link for peer review; please do not redistribute it.', ''] : []),
    input.unpublished
      ? `Version ${m.versionNumber}, not yet published · DOI reserved: ${doi} (it resolves once ${m.publisher.name} publishes the version)`
      : `Version ${m.versionNumber} · DOI [${doi}](${doiUrl(doi)}) · published by ${m.publisher.name} on ${isoDay(m.publishedAt)}`,
    ...(m.embargoUntil ? [`Files under embargo until ${isoDay(m.embargoUntil)}.`] : []),
    licence ? `Licence: ${licence.name} (${licence.id}), ${licence.url}` : 'Licence: none stated; ask the depositors before reuse.',
    '',
    '## About this dataset',
    '',
    ...(m.record.description?.trim() ? [m.record.description.trim(), ''] : []),
    ...peopleSection(input),
    '',
    '## Sample and measurement',
    '',
    ...describeTechnicalInfo(m.record).split('\n').map((l) => `- ${l}`),
    '',
    '## Columns and units',
    '',
    ...columnsSection(m.record),
    '',
    '## Files',
    '',
    ...filesSection(payload),
    '',
    '## How to cite',
    '',
    formatCitation(citation, 'text'),
    '',
    'The same citation is in `CITATION.cff` (Citation File Format) and `citation.bib` (BibTeX).',
    '',
    '## What is in this package',
    '',
    'This folder is a BagIt 1.0 bag (RFC 8493). `data/` holds the files exactly as deposited; `manifest-sha256.txt` lists',
    'the SHA-256 of each, `tagmanifest-sha256.txt` those of the other files, and `bag-info.txt` the payload size',
    '(Payload-Oxum). `metadata/ohmstead-record.json` is the full record, `metadata/datacite.xml` the DataCite 4.7 record.',
    '',
    'To check it, run any BagIt validator on the folder or on the zip, e.g. `npm run verify-bag -- PACKAGE.zip` from',
    'Ohmstead\'s source. Where no file name contains "%", `sha256sum -c manifest-sha256.txt` inside the folder works too',
    '(manifests write "%", CR and LF in names as %25, %0D and %0A).',
    '',
  ];
  return lines.join('\n');
}

// CITATION.cff (Citation File Format 1.2.0, whose root has no publisher key) for one version; strings are JSON-quoted,
// which YAML reads as is.
import { splitPersonName } from '@/lib/citation';
import { bareDoi, doiUrl, isoDay, orcidUrl } from '@/lib/datacite';
import { ANONYMOUS_AUTHOR } from './anonymise';
import type { PackageInput } from './types';

const q = (text: string) => JSON.stringify(text.replace(/\s+/g, ' ').trim());

function authorLines(input: PackageInput): string[] {
  if (input.anonymous) return [`  - name: ${q(ANONYMOUS_AUTHOR)}`];
  return input.metadata.record.creators.flatMap((c) => {
    const name = splitPersonName(c.name);
    const affiliation = (c.affiliation ?? []).map((a) => a.name).join('; ');
    return [
      `  - family-names: ${q(name.family)}`,
      ...(name.given ? [`    given-names: ${q(name.given)}`] : []),
      ...(c.orcid ? [`    orcid: ${q(orcidUrl(c.orcid))}`] : []),
      ...(affiliation ? [`    affiliation: ${q(affiliation)}`] : []),
    ];
  });
}

/** The CITATION.cff text (schema: Citation File Format 1.2.0, type dataset). */
export function buildCitationCff(input: PackageInput): string {
  const m = input.metadata;
  const doi = bareDoi(m.doi);
  const keywords = m.record.keywords ?? [];
  const abstract = m.record.description?.trim();
  const lines = [
    '# Citation File Format 1.2.0 (https://citation-file-format.github.io/)',
    'cff-version: 1.2.0',
    'message: "If you use this dataset, please cite it as below."',
    'type: dataset',
    `title: ${q(m.record.title)}`,
    `version: ${q(String(m.versionNumber))}`,
    `doi: ${q(doi)}`,
    `url: ${q(doiUrl(doi))}`,
    ...(input.unpublished ? [] : [`date-released: ${isoDay(m.publishedAt)}`]),
    ...(m.record.license ? [`license: ${q(m.record.license)}`] : []),
    'authors:',
    ...authorLines(input),
    'identifiers:',
    '  - type: doi',
    `    value: ${q(bareDoi(m.conceptDoi))}`,
    '    description: "All versions of this dataset"',
    ...(keywords.length ? ['keywords:', ...keywords.map((k) => `  - ${q(k)}`)] : []),
    ...(abstract ? [`abstract: ${JSON.stringify(abstract)}`] : []),
    '',
  ];
  return lines.join('\n');
}

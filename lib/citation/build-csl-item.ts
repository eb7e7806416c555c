import type { DataCiteInput } from '@/lib/datacite/types';
import { bareDoi, doiUrl } from '@/lib/datacite/identifiers';
import { splitPersonName } from './person-name';

/** What a citation needs: a subset of the DataCite builder's input, so callers build one object for both. */
export type CitationInput = Pick<DataCiteInput, 'doi' | 'kind' | 'versionNumber' | 'record' | 'publisher' | 'publicationYear' | 'language'>;

export type CslName = { family: string; given?: string };

/** A CSL-JSON item (CSL 1.0.2 input schema) for a dataset. */
export type CslItem = {
  id: string;
  type: 'dataset';
  title: string;
  author: CslName[];
  issued: { 'date-parts': [[number]] };
  publisher: string;
  DOI: string;
  URL: string;
  version?: string;
  keyword?: string;
  language?: string;
};

const oneLine = (text: string) => text.replace(/\s+/g, ' ').trim();

/** The CSL-JSON item every citation format is produced from; issued carries the year, as DataCite's citation does. */
export function buildCslItem(input: CitationInput): CslItem {
  const doi = bareDoi(input.doi);
  const keywords = (input.record.keywords ?? []).map((k) => oneLine(k.replace(/,/g, ' '))).filter(Boolean);
  return {
    id: doi,
    type: 'dataset',
    title: oneLine(input.record.title),
    author: input.record.creators.map((c) => splitPersonName(c.name)),
    issued: { 'date-parts': [[input.publicationYear]] },
    publisher: input.publisher.name,
    DOI: doi,
    URL: doiUrl(doi),
    ...(input.kind === 'version' ? { version: String(input.versionNumber) } : {}),
    // citation-js splits `keyword` on commas for RIS KW lines, so commas inside a keyword are dropped above.
    ...(keywords.length ? { keyword: keywords.join(',') } : {}),
    ...(input.language ? { language: input.language } : {}),
  };
}

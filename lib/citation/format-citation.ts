import { Cite } from '@citation-js/core';
// Each plugin registers its input/output formats with citation-js core on import.
import '@citation-js/plugin-bibtex';
import '@citation-js/plugin-csl';
import '@citation-js/plugin-ris';
import { buildCslItem, type CitationInput } from './build-csl-item';
import { formatCitationText } from './citation-text';

export type CitationFormat = 'text' | 'bibtex' | 'ris' | 'csl-json';

/** Media type and file extension of each format, for downloads and the API. */
export const CITATION_FORMATS: Record<CitationFormat, { mediaType: string; extension: string; label: string }> = {
  text: { mediaType: 'text/plain; charset=utf-8', extension: 'txt', label: 'Text' },
  bibtex: { mediaType: 'application/x-bibtex; charset=utf-8', extension: 'bib', label: 'BibTeX' },
  ris: { mediaType: 'application/x-research-info-systems; charset=utf-8', extension: 'ris', label: 'RIS' },
  'csl-json': { mediaType: 'application/vnd.citationstyles.csl+json', extension: 'json', label: 'CSL-JSON' },
};

export function isCitationFormat(value: string): value is CitationFormat {
  return Object.hasOwn(CITATION_FORMATS, value);
}

const RIS_WRAP = 70;

/**
 * plugin-ris 0.8.2 breaks every value after each 70 UTF-16 units (`replace(/(.{70})/g, '$1\n')`), leaving untagged
 * lines that importers read differently; a chunk continues exactly when the one before it is 70 units long.
 */
export function unwrapRis(text: string): string {
  const lines = text.split('\n');
  const out: string[] = [];
  for (let i = 0; i < lines.length; i++) {
    let line = lines[i];
    let chunk = line.slice('TY  - '.length);
    while (chunk.length === RIS_WRAP && i + 1 < lines.length) {
      chunk = lines[++i];
      line += chunk;
    }
    out.push(line);
  }
  return out.join('\n');
}

/** The citation of one dataset version (or its all-versions DOI) in the given format, through citation-js. */
export function formatCitation(input: CitationInput, format: CitationFormat): string {
  if (format === 'text') return formatCitationText(input);
  const cite = new Cite(buildCslItem(input));
  if (format === 'csl-json') return JSON.stringify(cite.format('data', { format: 'object' }), null, 2);
  // Keep RIS's closing "ER  - " intact (its trailing space is part of the tag); end with one newline.
  const text = cite.format(format).replace(/\n+$/, '');
  return (format === 'ris' ? unwrapRis(text) : text) + '\n';
}

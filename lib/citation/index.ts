// Pure citation builders: DataCite text, BibTeX, RIS and CSL-JSON (no DB, Next or React).
export { buildCslItem, type CitationInput, type CslItem, type CslName } from './build-csl-item';
export { formatCitationText } from './citation-text';
export { formatCitation, isCitationFormat, CITATION_FORMATS, type CitationFormat } from './format-citation';
export { splitPersonName, invertedName, type PersonName } from './person-name';

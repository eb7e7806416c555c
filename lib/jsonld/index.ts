// Pure schema.org JSON-LD builders for landing pages (no DB, Next or React).
export { buildDatasetJsonLd, isEmbargoed, type DatasetJsonLdInput, type JsonLdNode } from './build-dataset-jsonld';
export { serializeJsonLd } from './serialize-jsonld';
export { variablesFromSummaries, type MeasuredVariable } from './variables-from-summary';

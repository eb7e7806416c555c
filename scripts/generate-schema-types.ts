// Writes the modules generated from the schemas: schemas/transport-dataset.schema.json's TypeScript types and its
// precompiled Ajv validator, and the search query's types (schemas/api/search-query.schema.json). Run after changing
// either schema: npm run generate:schema
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { generateTransportDatasetTypes, TRANSPORT_DATASET_TYPES_PATH } from '../lib/schema/generate-transport-dataset-types';
import { generateTransportDatasetValidator, TRANSPORT_DATASET_VALIDATOR_PATH } from '../lib/schema/generate-transport-dataset-validator';
import { generateSearchQueryTypes, SEARCH_QUERY_TYPES_PATH } from '../lib/search/generate-search-query-types';

for (const [target, text] of [
  [TRANSPORT_DATASET_TYPES_PATH, generateTransportDatasetTypes()],
  [TRANSPORT_DATASET_VALIDATOR_PATH, generateTransportDatasetValidator()],
  [SEARCH_QUERY_TYPES_PATH, generateSearchQueryTypes()],
] as const) {
  writeFileSync(path.resolve(import.meta.dirname, '..', target), text);
  console.log(`wrote ${target}`);
}

// Writes the modules generated from schemas/transport-dataset.schema.json: its TypeScript types and its precompiled
// Ajv validator. Run after changing the schema: npm run generate:schema
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { generateTransportDatasetTypes, TRANSPORT_DATASET_TYPES_PATH } from '../lib/schema/generate-transport-dataset-types';
import { generateTransportDatasetValidator, TRANSPORT_DATASET_VALIDATOR_PATH } from '../lib/schema/generate-transport-dataset-validator';

for (const [target, text] of [
  [TRANSPORT_DATASET_TYPES_PATH, generateTransportDatasetTypes()],
  [TRANSPORT_DATASET_VALIDATOR_PATH, generateTransportDatasetValidator()],
] as const) {
  writeFileSync(path.resolve(import.meta.dirname, '..', target), text);
  console.log(`wrote ${target}`);
}

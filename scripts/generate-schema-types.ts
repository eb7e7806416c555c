// Writes lib/schema/transport-dataset.types.ts from schemas/transport-dataset.schema.json.
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { generateTransportDatasetTypes, TRANSPORT_DATASET_TYPES_PATH } from '../lib/schema/generate-transport-dataset-types';

const target = path.resolve(import.meta.dirname, '..', TRANSPORT_DATASET_TYPES_PATH);
writeFileSync(target, generateTransportDatasetTypes());
console.log(`wrote ${TRANSPORT_DATASET_TYPES_PATH}`);

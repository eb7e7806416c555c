import schema from '@/schemas/transport-dataset.schema.json';
import { schemaToTypeScript, type JsonSchema } from './schema-to-ts';

export const TRANSPORT_DATASET_TYPES_PATH = 'lib/schema/transport-dataset.types.ts';

/** Text of lib/schema/transport-dataset.types.ts as the generator produces it from the committed schema. */
export function generateTransportDatasetTypes(): string {
  return schemaToTypeScript(schema as unknown as JsonSchema, {
    rootName: 'TransportDataset',
    source: 'schemas/transport-dataset.schema.json',
  });
}

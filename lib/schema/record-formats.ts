import { isValidOrcid } from './orcid';

/** The custom string formats of schemas/transport-dataset.schema.json, for Ajv at generation time and the generated validator. */
export const recordFormats = {
  orcid: { type: 'string' as const, validate: isValidOrcid },
};

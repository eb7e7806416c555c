// Ajv over the built OpenAPI document, configured as the app configures it (lib/validation, lib/schema): 2020-12,
// strict, standard formats plus "orcid". Schemas are compiled by reference into the document, so the embedded copies
// (with their rewritten $refs) are what gets checked.
import Ajv2020, { type ValidateFunction } from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import { isValidOrcid } from '@/lib/schema/orcid';

export const DOC_ID = 'https://ohmstead.example/openapi.json';

export function documentAjv(doc: Record<string, unknown>): { ajv: Ajv2020; compileRef: (ref: string) => ValidateFunction } {
  const ajv = new Ajv2020({ allErrors: true, strict: true });
  addFormats(ajv);
  ajv.addFormat('orcid', { type: 'string', validate: isValidOrcid });
  // Ajv compiles the root of a referenced document: its OpenAPI fields are declared as plain annotations, so strict
  // mode still checks every schema keyword inside components/schemas.
  for (const key of Object.keys(doc)) ajv.addKeyword({ keyword: key });
  ajv.addSchema(doc, DOC_ID);
  const cache = new Map<string, ValidateFunction>();
  const compileRef = (ref: string) => {
    let fn = cache.get(ref);
    if (!fn) cache.set(ref, (fn = ajv.compile({ $ref: `${DOC_ID}${ref}` })));
    return fn;
  };
  return { ajv, compileRef };
}

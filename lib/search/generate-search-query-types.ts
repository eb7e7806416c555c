import schema from '@/schemas/api/search-query.schema.json';
import { schemaToTypeScript, type JsonSchema } from '@/lib/schema/schema-to-ts';

export const SEARCH_QUERY_TYPES_PATH = 'lib/search/search-query.types.ts';

/** Text of lib/search/search-query.types.ts as the generator produces it from the committed schema. */
export function generateSearchQueryTypes(): string {
  return schemaToTypeScript(schema as unknown as JsonSchema, {
    rootName: 'SearchQuery',
    source: 'schemas/api/search-query.schema.json',
  });
}

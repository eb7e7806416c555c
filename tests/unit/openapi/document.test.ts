// The whole OpenAPI document: valid OpenAPI 3.1 (by an independent validator), every embedded schema compiles under
// Ajv 2020 strict and still accepts and refuses what its file does, every $ref resolves, and facts it states match the code.
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { Validator } from '@seriousme/openapi-schema-validator';
import { describe, expect, it } from 'vitest';
import { ACTIONS } from '@/lib/access/types';
import { CITATION_FORMATS } from '@/lib/citation/format-citation';
import { STATUS_BY_CODE } from '@/lib/errors';
import { buildOpenApi } from '@/lib/openapi/build-openapi';
import { DOCUMENTED_LIMITS } from '@/lib/openapi/error-responses';
import { OPERATIONS } from '@/lib/openapi/routes';
import { SCHEMA_FILES } from '@/lib/openapi/schema-files';
import { API_PER_IP_ANONYMOUS, API_PER_TOKEN } from '@/lib/tokens/api-rate-limit';
import transportDataset from '@/schemas/transport-dataset.schema.json';
import { documentAjv } from './document-ajv';

type Json = Record<string, unknown>;
const doc = buildOpenApi() as Json & { paths: Record<string, Record<string, Json>>; components: { schemas: Record<string, Json>; responses: Record<string, Json> } };

const { compileRef } = documentAjv(doc);
const component = (name: string) => compileRef(`#/components/schemas/${name}`);

function resolvePointer(root: unknown, ref: string): unknown {
  let node: unknown = root;
  for (const raw of ref.replace(/^#\//, '').split('/')) {
    const key = raw.replace(/~1/g, '/').replace(/~0/g, '~');
    node = node && typeof node === 'object' ? (node as Json)[key] : undefined;
  }
  return node;
}

function allRefs(node: unknown, out: string[] = []): string[] {
  if (Array.isArray(node)) node.forEach((n) => allRefs(n, out));
  else if (node && typeof node === 'object') {
    for (const [k, v] of Object.entries(node)) {
      if (k === '$ref' && typeof v === 'string') out.push(v);
      else if (k !== 'example' && k !== 'examples') allRefs(v, out);
    }
  }
  return out;
}

describe('the OpenAPI document', () => {
  it('is valid OpenAPI 3.1 according to @seriousme/openapi-schema-validator', async () => {
    const validator = new Validator();
    const result = await validator.validate(structuredClone(doc));
    expect(result.errors).toBeUndefined();
    expect(result.valid).toBe(true);
    expect(validator.version).toBe('3.1');
  });

  it('round-trips through JSON unchanged (what the route serves)', () => {
    expect(JSON.parse(JSON.stringify(doc))).toEqual(doc);
  });

  it('has every $ref pointing at something in the document', () => {
    const refs = allRefs(doc);
    expect(refs.length).toBeGreaterThan(150);
    expect(refs.filter((r) => !r.startsWith('#/') || resolvePointer(doc, r) === undefined)).toEqual([]);
  });

  it('embeds every schema file under schemas/api/ and the dataset record, each once', () => {
    const root = path.resolve(import.meta.dirname, '../../../schemas');
    const onDisk = (dir: string): string[] =>
      readdirSync(path.join(root, dir), { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? onDisk(`${dir}/${e.name}`) : e.name.endsWith('.json') ? [`schemas/${dir}/${e.name}`] : []));
    const listed = SCHEMA_FILES.map(([p]) => p);
    expect(listed.filter((p) => p.startsWith('schemas/api/')).sort()).toEqual(onDisk('api').sort());
    expect(listed).toContain('schemas/transport-dataset.schema.json');
    expect(Object.keys(doc.components.schemas)).toHaveLength(listed.length);
    expect(doc.components.schemas.TransportDataset.$comment).toBe('Source: schemas/transport-dataset.schema.json ($id https://ohmstead.example/schemas/transport-dataset/1.0.0).');
  });

  it('compiles every embedded schema with Ajv 2020 in strict mode', () => {
    const failures: string[] = [];
    for (const name of Object.keys(doc.components.schemas)) {
      try {
        component(name);
      } catch (error) {
        failures.push(`${name}: ${(error as Error).message}`);
      }
    }
    expect(failures).toEqual([]);
  });

  it('keeps the dataset record schema working after embedding: its example passes, a negative thickness does not', () => {
    const validate = component('TransportDataset');
    const example = structuredClone(transportDataset.examples[0]) as Json & { sample: { geometry: Json } };
    expect(validate(example)).toBe(true);
    example.sample.geometry.thickness = { value: -5, unit: 'nm' };
    expect(validate(example)).toBe(false);
    expect(validate.errors?.[0]?.instancePath).toBe('/sample/geometry/thickness/value');
    // The creator's ORCID check digit (format "orcid") still applies: 0000-0000-3141-5921 has the wrong last digit.
    const badOrcid = structuredClone(transportDataset.examples[0]) as { creators: { orcid?: string }[] };
    badOrcid.creators[0].orcid = '0000-0000-3141-5921';
    expect(validate(badOrcid)).toBe(false);
  });

  it('accepts every request body example of the operation list, and refuses one with an unknown field', () => {
    // Every body but the dataset record (whose schema carries its own example) has one.
    expect(OPERATIONS.filter((op) => op.body && op.body.example === undefined).map((op) => op.operationId)).toEqual(['putMetadata']);
    const withExamples = OPERATIONS.filter((op) => op.body?.example !== undefined);
    for (const op of withExamples) {
      const media = (doc.paths[op.path][op.method].requestBody as Json).content as Record<string, { schema: { $ref: string } }>;
      const validate = compileRef(media['application/json'].schema.$ref);
      expect({ op: op.operationId, ok: validate(op.body!.example), errors: validate.errors ?? null }).toEqual({ op: op.operationId, ok: true, errors: null });
      if (typeof op.body!.example === 'object' && !Array.isArray(op.body!.example)) expect(validate({ ...(op.body!.example as Json), surplus: 1 })).toBe(false);
    }
  });

  it('states the token scope each operation needs, as lib/tokens/scopes.ts decides it', () => {
    const security = (p: string, m: string) => doc.paths[p][m].security;
    expect(security('/datasets', 'post')).toEqual([{ bearerToken: ['deposit'] }, { sessionCookie: [] }]);
    expect(security('/versions/{versionId}/publish', 'post')).toEqual([{ bearerToken: ['publish'] }, { sessionCookie: [] }]);
    expect(security('/versions/{versionId}', 'get')).toEqual([{}, { bearerToken: ['read'] }, { sessionCookie: [] }]);
    expect(security('/tokens', 'post')).toEqual([{ sessionCookie: [] }]);
    expect(security('/openapi.json', 'get')).toEqual([]);
  });

  it('lists the refusals each route can give, with the shared error body', () => {
    const statuses = (p: string, m: string) => Object.keys(doc.paths[p][m].responses as Json);
    expect(statuses('/versions/{versionId}/uploads', 'post')).toEqual(['201', '401', '403', '404', '409', '413', '422', '429', '500', '503']);
    expect(statuses('/openapi.json', 'get')).toEqual(['200', '304', '500']);
    const conflict = (doc.paths['/groups/{slug}/members/{userId}'].patch.responses as Json)['409'];
    expect(conflict).toEqual({ $ref: '#/components/responses/Conflict', description: 'The group would be left without an owner.' });
    expect((doc.components.responses.RateLimited.headers as Json)['Retry-After']).toBeDefined();
  });

  it('matches the code on limits, error codes, actions and citation formats', () => {
    expect(DOCUMENTED_LIMITS).toEqual({ perTokenPerMinute: API_PER_TOKEN.max, perAddressPerMinute: API_PER_IP_ANONYMOUS.max });
    const errorCodes = ((doc.components.schemas.Error.properties as Json).error as { properties: { code: { enum: string[] } } }).properties.code.enum;
    expect([...errorCodes].sort()).toEqual(Object.keys(STATUS_BY_CODE).sort());
    const version = doc.components.schemas.VersionView as { properties: { allowedActions: { items: { enum: string[] } } } };
    expect(version.properties.allowedActions.items.enum).toEqual([...ACTIONS]);
    const citationFormat = (doc.paths['/versions/{versionId}/citation'].get.parameters as { name: string; schema: { enum: string[] } }[]).find((p) => p.name === 'format');
    expect(citationFormat?.schema.enum).toEqual(Object.keys(CITATION_FORMATS));
  });
});

// Assembles the OpenAPI 3.1 document of /api/v1 from the operation list and the JSON Schema files (pure; no I/O).
import pkg from '@/package.json';
import { scopeForRequest } from '@/lib/tokens/scopes';
import { COMPONENT_PREFIX, embedSchemas, type JsonObject } from './embed-schemas';
import { errorComponentName, errorResponseComponents, operationErrors } from './error-responses';
import { OPERATIONS } from './routes';
import { SCHEMA_FILES } from './schema-files';
import { TAGS, type OperationSpec } from './types';

export const API_BASE_PATH = '/api/v1';
export const SESSION_COOKIE = 'next-auth.session-token';

const UUID_PARAM = { type: 'string', format: 'uuid' };
const PATH_PARAMS: Record<string, { description: string; schema: JsonObject }> = {
  versionId: { description: 'A dataset version\'s id (from POST /datasets, GET /drafts or a landing page).', schema: UUID_PARAM },
  fileId: { description: 'A file\'s id (from POST /versions/{versionId}/uploads or GET /versions/{versionId}).', schema: UUID_PARAM },
  slug: { description: 'The group\'s address, e.g. larkspur-cryogenic.', schema: { type: 'string', pattern: '^[a-z0-9]+(-[a-z0-9]+)*$' } },
  userId: { description: 'A member\'s user id (from GET /groups/{slug}/members).', schema: UUID_PARAM },
  invitationId: { description: 'An invitation\'s id (from GET /groups/{slug}/invitations).', schema: UUID_PARAM },
  linkId: { description: 'A reviewer link\'s id.', schema: UUID_PARAM },
  tokenId: { description: 'An API token\'s id (from GET /tokens).', schema: UUID_PARAM },
};

const DESCRIPTION = [
  'The scriptable interface of Ohmstead. Every request body and answer below is described by the same JSON Schemas',
  '(2020-12) the server validates with; they are embedded under components/schemas.',
  '',
  '**Authentication.** Send a personal access token as `Authorization: Bearer ohm_…` (create one at /settings/tokens).',
  'A token carries scopes: `read` for GET routes, `deposit` for other writes, `publish` for publish, return and',
  'withdraw, `admin` for site administration; writing scopes include read, admin includes all. The browser app uses',
  'its session cookie instead, which holds every scope.',
  '',
  '**Errors** are `{ "error": { "code", "message", "details", "requestId" } }` with the status of the code',
  '(422 validation_failed with details.fieldErrors, 401, 403, 404, 409, 413, 429 with Retry-After, 503).',
  '',
  '**Uploads** go straight to object storage: begin an upload with the file\'s size and SHA-256, PUT each part to its',
  'presigned URL, then complete; the server checks the digest before keeping the file.',
].join('\n');

const pointer = (segment: string) => segment.replace(/~/g, '~0').replace(/\//g, '~1');

/** The scope a token needs for this operation, as lib/tokens/scopes.ts decides it for a real request. */
export function tokenScopeOf(op: Pick<OperationSpec, 'method' | 'path'>): string {
  return scopeForRequest(op.method.toUpperCase(), API_BASE_PATH + op.path.replace(/\{[^}]+\}/g, 'x'));
}

function securityOf(op: OperationSpec, scope: string): JsonObject[] {
  const bearer = { bearerToken: [scope] };
  const cookie = { sessionCookie: [] };
  if (op.auth === 'none') return [];
  if (op.auth === 'session') return [cookie];
  return op.auth === 'optional' ? [{}, bearer, cookie] : [bearer, cookie];
}

function parametersOf(op: OperationSpec, componentOf: (file: string) => string): JsonObject[] {
  const params: JsonObject[] = [];
  for (const [, name] of op.path.matchAll(/\{([^}]+)\}/g)) {
    if (!PATH_PARAMS[name]) throw new Error(`${op.operationId}: no description of path parameter {${name}} in build-openapi.ts.`);
    params.push({ $ref: `#/components/parameters/${name}` });
  }
  if (Array.isArray(op.query)) {
    for (const q of op.query) params.push({ name: q.name, in: 'query', required: q.required ?? false, description: q.description, schema: q.schema, ...(q.example === undefined ? {} : { example: q.example }) });
  } else if (op.query) {
    const file = op.query.schema;
    const component = componentOf(file);
    const schema = SCHEMA_FILES.find(([path]) => path === file)?.[1] as { properties?: Record<string, JsonObject>; required?: string[] };
    for (const [name, prop] of Object.entries(schema.properties ?? {})) {
      params.push({
        name, in: 'query', required: schema.required?.includes(name) ?? false, description: String(prop.description ?? prop.title ?? name),
        schema: { $ref: `${COMPONENT_PREFIX}${component}/properties/${pointer(name)}` },
      });
    }
  }
  return params;
}

function operationObject(op: OperationSpec, componentOf: (file: string) => string): JsonObject {
  const scope = tokenScopeOf(op);
  const responses: Record<string, JsonObject> = {};
  for (const r of op.responses) {
    const content: Record<string, JsonObject> = {};
    if (r.schema) content[r.schemaMediaType ?? 'application/json'] = { schema: { $ref: COMPONENT_PREFIX + componentOf(r.schema) } };
    Object.assign(content, r.content);
    responses[String(r.status)] = { description: r.description, ...(Object.keys(content).length ? { content } : {}), ...(r.headers ? { headers: r.headers } : {}) };
  }
  for (const [status, reason] of operationErrors(op.auth, op.auth === 'none' ? null : scope, op.errors)) {
    responses[String(status)] = { $ref: `#/components/responses/${errorComponentName(status)}`, ...(reason ? { description: reason } : {}) };
  }
  const out: JsonObject = {
    operationId: op.operationId, tags: [op.tag], summary: op.summary, ...(op.description ? { description: op.description } : {}),
    security: securityOf(op, scope),
  };
  const parameters = parametersOf(op, componentOf);
  if (parameters.length) out.parameters = parameters;
  if (op.body) {
    const media: JsonObject = { schema: { $ref: COMPONENT_PREFIX + componentOf(op.body.schema) } };
    if (op.body.example !== undefined) media.example = op.body.example;
    out.requestBody = { required: op.body.required, ...(op.body.description ? { description: op.body.description } : {}), content: { 'application/json': media } };
  }
  out.responses = responses;
  return out;
}

/** The whole document; `operations` defaults to lib/openapi/routes.ts. */
export function buildOpenApi(operations: readonly OperationSpec[] = OPERATIONS): JsonObject {
  const { schemas, byFile } = embedSchemas(SCHEMA_FILES);
  const componentOf = (file: string): string => {
    const name = byFile.get(file);
    if (!name) throw new Error(`Schema file ${file} is not listed in lib/openapi/schema-files.ts.`);
    return name;
  };
  const paths: Record<string, Record<string, JsonObject>> = {};
  const seen = new Set<string>();
  for (const op of operations) {
    if (seen.has(op.operationId)) throw new Error(`operationId ${op.operationId} is used twice.`);
    seen.add(op.operationId);
    const item = (paths[op.path] ??= {});
    if (item[op.method]) throw new Error(`${op.method.toUpperCase()} ${op.path} is listed twice.`);
    item[op.method] = operationObject(op, componentOf);
  }
  const sortedPaths = Object.fromEntries(Object.entries(paths).sort(([a], [b]) => a.localeCompare(b)));
  return {
    openapi: '3.1.0',
    jsonSchemaDialect: 'https://json-schema.org/draft/2020-12/schema',
    info: { title: 'Ohmstead API', version: pkg.version, summary: 'Deposit, review, publish, find and reuse electrical-transport datasets.', description: DESCRIPTION },
    servers: [{ url: API_BASE_PATH, description: 'This Ohmstead site' }],
    tags: TAGS.map((t) => ({ ...t })),
    paths: sortedPaths,
    components: {
      schemas,
      responses: errorResponseComponents(),
      parameters: Object.fromEntries(Object.entries(PATH_PARAMS).map(([name, p]) => [name, { name, in: 'path', required: true, ...p }])),
      securitySchemes: {
        bearerToken: {
          type: 'http', scheme: 'bearer', bearerFormat: 'ohm_ followed by 43 base64url characters',
          description: 'A personal access token from /settings/tokens. The list of a requirement names the scope the token needs.',
        },
        sessionCookie: {
          type: 'apiKey', in: 'cookie', name: SESSION_COOKIE,
          description: `The browser app's sign-in session (named __Secure-${SESSION_COOKIE} on https); it holds every scope.`,
        },
      },
    },
  };
}

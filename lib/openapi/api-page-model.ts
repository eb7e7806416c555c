// What the API page shows of each operation, read from the built OpenAPI document (so page and document agree).
import { curlExample } from './curl-example';
import { deref, fieldRows, typeText, type FieldRow } from './describe-schema';
import type { JsonObject } from './embed-schemas';
import { TAGS, type OperationSpec } from './types';

export type ParamView = { name: string; location: 'path' | 'query'; required: boolean; type: string; description: string };
export type ResponseView = { status: string; description: string; body: string | null };
export type OperationView = {
  anchor: string;
  method: string;
  path: string;
  summary: string;
  description: string | null;
  access: { kind: OperationSpec['auth']; scope: string | null; text: string };
  params: ParamView[];
  body: { required: boolean; description: string | null; schemaName: string; fields: FieldRow[] } | null;
  responses: ResponseView[];
  errors: ResponseView[];
  curl: string;
};
export type TagView = { name: string; anchor: string; description: string; operations: OperationView[] };

type Operation = JsonObject & { security?: Record<string, string[]>[]; parameters?: JsonObject[]; requestBody?: JsonObject; responses: Record<string, JsonObject> };

export const anchorOf = (text: string) => text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '');

function accessOf(auth: OperationSpec['auth'], op: Operation): OperationView['access'] {
  const scope = op.security?.find((s) => s.bearerToken)?.bearerToken[0] ?? null;
  const text = {
    none: 'No sign-in needed.',
    optional: `Public data for anyone; with a token (scope ${scope}) or a session you also see what your groups may see.`,
    required: `A token with scope ${scope}, or a signed-in browser session.`,
    session: 'A signed-in browser session only; API tokens are refused.',
  }[auth];
  return { kind: auth, scope, text };
}

const componentName = (schema: JsonObject | undefined) => (typeof schema?.$ref === 'string' ? schema.$ref.split('/').pop() ?? null : null);

function responseView(doc: JsonObject, status: string, response: JsonObject): ResponseView {
  const resolved = deref(doc, response);
  const content = (resolved.content ?? {}) as Record<string, JsonObject>;
  const types = Object.entries(content).map(([media, m]) => (componentName(m.schema as JsonObject) ? `${componentName(m.schema as JsonObject)} (${media === 'application/json' ? 'JSON' : media})` : media));
  return { status, description: String(response.description ?? resolved.description ?? ''), body: types.length ? types.join(', ') : null };
}

function operationView(doc: JsonObject, spec: OperationSpec): OperationView {
  const op = ((doc.paths as Record<string, Record<string, Operation>>)[spec.path] ?? {})[spec.method];
  if (!op) throw new Error(`${spec.operationId} is not in the document.`);
  const params = (op.parameters ?? []).map((p) => deref(doc, p)).map((p) => ({
    name: String(p.name), location: p.in as 'path' | 'query', required: Boolean(p.required),
    type: typeText(doc, (p.schema as JsonObject) ?? {}), description: String(p.description ?? ''),
  }));
  const media = (op.requestBody?.content as Record<string, JsonObject> | undefined)?.['application/json'];
  const bodySchema = media?.schema as JsonObject | undefined;
  const statuses = Object.entries(op.responses);
  return {
    anchor: anchorOf(`${spec.method} ${spec.path}`),
    method: spec.method.toUpperCase(),
    path: spec.path,
    summary: spec.summary,
    description: spec.description ?? null,
    access: accessOf(spec.auth, op),
    params,
    body: bodySchema ? {
      required: Boolean(op.requestBody?.required), description: typeof op.requestBody?.description === 'string' ? op.requestBody.description : null,
      schemaName: componentName(bodySchema) ?? 'object', fields: fieldRows(doc, bodySchema),
    } : null,
    responses: statuses.filter(([s]) => Number(s) < 400).map(([s, r]) => responseView(doc, s, r)),
    errors: statuses.filter(([s]) => Number(s) >= 400).map(([s, r]) => responseView(doc, s, r)),
    curl: curlExample(doc, spec.method, spec.path),
  };
}

/** The page's sections: one per tag, in the document's tag order, operations in the order of lib/openapi/routes.ts. */
export function apiPageModel(doc: JsonObject, operations: readonly OperationSpec[]): TagView[] {
  return TAGS.map((tag) => ({
    name: tag.name, anchor: anchorOf(tag.name), description: tag.description,
    operations: operations.filter((op) => op.tag === tag.name).map((op) => operationView(doc, op)),
  })).filter((t) => t.operations.length > 0);
}

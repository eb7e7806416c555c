// The declarative shape of one /api/v1 operation, as lib/openapi/routes*.ts list them and build-openapi.ts renders them.
import type { JsonObject } from './embed-schemas';

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * none: the route never looks at the caller; optional: anonymous callers see public data, signed-in ones more;
 * required: a session cookie or a Bearer token; session: a browser session only (tokens get 403).
 */
export type AuthMode = 'none' | 'optional' | 'required' | 'session';

export type ErrorStatus = 400 | 401 | 403 | 404 | 409 | 413 | 422 | 429 | 503;

export const TAGS = [
  { name: 'Datasets', description: 'Start datasets, read versions, save the measurement record.' },
  { name: 'Files', description: 'Upload files in parts straight to storage, verify them by SHA-256, read their analysis and curves.' },
  { name: 'Review and publishing', description: 'Submit, return, publish and withdraw versions; citations and DataCite records.' },
  { name: 'Reviewer links', description: 'Private, expiring links that let referees read a version before it is public.' },
  { name: 'Search and reuse', description: 'Find published datasets, compare curves across them and download packages.' },
  { name: 'Groups', description: 'Labs and teams: members, roles, invitations, ownership and storage.' },
  { name: 'Audit log', description: 'Security-relevant actions, for curators (their group) and site admins (all).' },
  { name: 'API tokens', description: 'Personal access tokens; managed from a browser session only.' },
  { name: 'About the API', description: 'This document.' },
] as const;

export type TagName = (typeof TAGS)[number]['name'];

export type QueryParam = { name: string; description: string; schema: JsonObject; required?: boolean; example?: unknown };

export type BodySpec = {
  /** A file listed in schema-files.ts, e.g. 'schemas/api/create-dataset.schema.json'. */
  schema: string;
  required: boolean;
  description?: string;
  /** Checked against the schema by tests/unit/openapi; shown in the curl examples. */
  example?: unknown;
};

export type ResponseSpec = {
  status: 200 | 201 | 202 | 204 | 206 | 302 | 304 | 416;
  description: string;
  /** A response schema file. */
  schema?: string;
  /** The media type `schema` is served as; application/json unless given. */
  schemaMediaType?: string;
  /** Other media types (citations, XML, CSV), each with an inline schema. */
  content?: Record<string, JsonObject>;
  headers?: Record<string, { description: string; schema: JsonObject }>;
};

export type OperationSpec = {
  method: HttpMethod;
  /** Relative to the server URL /api/v1, with {param} placeholders. */
  path: string;
  operationId: string;
  tag: TagName;
  summary: string;
  description?: string;
  auth: AuthMode;
  query?: QueryParam[] | { schema: string };
  body?: BodySpec;
  responses: ResponseSpec[];
  /** Refusals this route gives, each with the route's own reason. 401 and 429 are added for every route that reads the caller. */
  errors?: Partial<Record<ErrorStatus, string>>;
};

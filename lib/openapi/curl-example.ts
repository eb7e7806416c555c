// A curl command for one operation of the built document: the token (or session cookie) header, path parameters as
// shell variables, the documented query example, and the request body example.
import { shellQuote } from '@/lib/format/shell-quote';
import { API_BASE_PATH, SESSION_COOKIE } from './build-openapi';
import { deref } from './describe-schema';
import type { JsonObject } from './embed-schemas';

/** versionId → $VERSION_ID */
export const shellVariable = (param: string) => `$${param.replace(/([a-z0-9])([A-Z])/g, '$1_$2').toUpperCase()}`;

type Operation = JsonObject & { security?: JsonObject[]; parameters?: JsonObject[]; requestBody?: JsonObject; responses?: Record<string, JsonObject> };

function bodyExample(doc: JsonObject, op: Operation): { inline: unknown } | { file: string } | null {
  const media = (op.requestBody?.content as Record<string, JsonObject> | undefined)?.['application/json'];
  if (!media) return null;
  if (media.example !== undefined) return { inline: media.example };
  const schema = deref(doc, (media.schema as JsonObject) ?? {});
  // A whole record (e.g. the dataset record) reads better from a file than inline.
  return Array.isArray(schema.examples) ? { file: 'record.json' } : { inline: {} };
}

/** Short bodies on one line; longer ones indented under the -d, so they read without scrolling. */
function jsonText(value: unknown): string {
  const flat = JSON.stringify(value);
  return flat.length <= 72 ? flat : JSON.stringify(value, null, 2).replace(/\n/g, '\n  ');
}

/** Whether the answer is a file to save (zip, raw bytes) rather than JSON to read. */
function savesFile(op: Operation): boolean {
  return Object.values(op.responses ?? {}).some((r) => Object.keys((r.content as JsonObject | undefined) ?? {}).some((t) => t === 'application/zip' || t === 'application/octet-stream'));
}

export function curlExample(doc: JsonObject, method: string, path: string): string {
  const op = ((doc.paths as Record<string, Record<string, Operation>>)[path] ?? {})[method];
  if (!op) throw new Error(`No ${method.toUpperCase()} ${path} in the document.`);
  const query = (op.parameters ?? []).filter((p) => p.in === 'query' && p.example !== undefined).map((p) => `${p.name}=${encodeURIComponent(String(p.example))}`);
  const url = `$OHMSTEAD${API_BASE_PATH}${path.replace(/\{([^}]+)\}/g, (_m, name: string) => shellVariable(name))}${query.length ? `?${query.join('&')}` : ''}`;
  const head = ['curl', ...(savesFile(op) ? ['-L', '-OJ'] : []), ...(method === 'get' ? [] : ['-X', method.toUpperCase()]), `"${url}"`].join(' ');
  const lines = [head];
  const security = op.security ?? [];
  if (security.some((s) => 'bearerToken' in s)) lines.push('-H "Authorization: Bearer $OHMSTEAD_TOKEN"');
  else if (security.some((s) => 'sessionCookie' in s)) lines.push(`-b "${SESSION_COOKIE}=$SESSION_COOKIE"`);
  const body = bodyExample(doc, op);
  if (body) {
    lines.push('-H "Content-Type: application/json"');
    lines.push('file' in body ? `--data @${body.file}` : `-d ${shellQuote(jsonText(body.inline))}`);
  }
  return lines.join(' \\\n  ');
}

// Reads which HTTP methods each app/api/v1/**/route.ts exports, from the source text (no import, so no services).
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

export const HTTP_METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS'] as const;
const METHOD = HTTP_METHODS.join('|');
const DIRECT = new RegExp(`export\\s+(?:const|let|var)\\s+(${METHOD})\\b|export\\s+(?:async\\s+)?function\\s*\\*?\\s*(${METHOD})\\b`, 'g');
const LIST = /export\s*(?:type\s*)?\{([^}]*)\}/g;

/** Exported HTTP method names of one route file's source, sorted. */
export function exportedMethods(source: string): string[] {
  const found = new Set<string>();
  for (const m of source.matchAll(DIRECT)) found.add(m[1] ?? m[2]);
  for (const m of source.matchAll(LIST)) {
    if (/^\s*type\b/.test(m[0].slice(6))) continue;
    for (const part of m[1].split(',')) {
      const name = part.trim().split(/\s+as\s+/).pop()?.trim();
      if (name && (HTTP_METHODS as readonly string[]).includes(name)) found.add(name);
    }
  }
  return [...found].sort();
}

/** "app/api/v1/versions/[versionId]/publish/route.ts" (relative to the API root) → "/versions/{versionId}/publish". */
export function openApiPath(relativeDir: string): string {
  const segments = relativeDir.split(/[\\/]/).filter(Boolean)
    // Route groups "(name)" do not appear in the URL.
    .filter((s) => !/^\(.*\)$/.test(s))
    .map((s) => s.replace(/^\[\[?\.\.\.(.+?)\]?\]$/, '{$1}').replace(/^\[(.+)\]$/, '{$1}'));
  return `/${segments.join('/')}`;
}

/** "METHOD /path" for every exported method of every route.ts under `apiRoot`. */
export function routeOperations(apiRoot: string): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (/^route\.(ts|tsx|js|mjs)$/.test(entry.name)) {
        const url = openApiPath(path.relative(apiRoot, dir));
        for (const method of exportedMethods(readFileSync(full, 'utf8'))) out.push(`${method} ${url}`);
      }
    }
  };
  walk(apiRoot);
  return out.sort();
}

/** "METHOD /path" for every operation of an OpenAPI document's paths. */
export function documentedOperations(doc: { paths?: Record<string, Record<string, unknown>> }): string[] {
  const out: string[] = [];
  for (const [url, item] of Object.entries(doc.paths ?? {})) {
    for (const key of Object.keys(item)) if ((HTTP_METHODS as readonly string[]).includes(key.toUpperCase())) out.push(`${key.toUpperCase()} ${url}`);
  }
  return out.sort();
}

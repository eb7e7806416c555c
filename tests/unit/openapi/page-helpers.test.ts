// The API page's pieces, read from the real document: field rows, curl commands, the model's sections.
import { describe, expect, it } from 'vitest';
import { apiPageModel } from '@/lib/openapi/api-page-model';
import { buildOpenApi } from '@/lib/openapi/build-openapi';
import { shellQuote } from '@/lib/format/shell-quote';
import { curlExample, shellVariable } from '@/lib/openapi/curl-example';
import { fieldRows } from '@/lib/openapi/describe-schema';
import { OPERATIONS } from '@/lib/openapi/routes';

const doc = buildOpenApi();

describe('field rows', () => {
  it('lists the create-dataset body with types, required flags and limits from its schema', () => {
    expect(fieldRows(doc, { $ref: '#/components/schemas/CreateDataset' })).toEqual([
      { name: 'group', type: 'text', required: true, description: "Group. The group's slug, e.g. larkspur-cryogenic.", limits: ['1–80 characters'] },
      { name: 'title', type: 'text', required: true, description: 'Title', limits: ['1–300 characters'] },
    ]);
  });

  it('names enums, nullable types and referenced components', () => {
    const upload = fieldRows(doc, { $ref: '#/components/schemas/BeginUpload' });
    expect(upload.find((f) => f.name === 'role')).toMatchObject({ type: 'one of raw, processed, other', required: false });
    expect(upload.find((f) => f.name === 'sha256')?.limits).toEqual(['pattern ^[0-9a-f]{64}$']);
    expect(upload.find((f) => f.name === 'sizeBytes')?.limits).toEqual(['at least 0']);
    expect(upload.find((f) => f.name === 'mediaType')?.limits).toEqual(['at most 127 characters']);
    const token = fieldRows(doc, { $ref: '#/components/schemas/CreateApiToken' });
    expect(token.find((f) => f.name === 'expiresInDays')).toMatchObject({ type: 'whole number or null', limits: ['1–365'] });
    expect(token.find((f) => f.name === 'scopes')?.type).toBe('list of one of read, deposit, publish, admin');
    const record = fieldRows(doc, { $ref: '#/components/schemas/TransportDataset' });
    expect(record.slice(0, 4).map((f) => f.name)).toEqual(['title', 'creators', 'sample', 'measurement']);
    expect(record.find((f) => f.name === 'creators')?.type).toBe('list of Creator');
    expect(record.find((f) => f.name === 'license')?.type).toMatch(/^one of CC-BY-4\.0, /);
  });

  it('merges allOf parts (the created token has every token field plus the secret)', () => {
    const names = fieldRows(doc, { $ref: '#/components/schemas/ApiTokenCreated' }).map((f) => f.name);
    expect(names).toContain('token');
    expect(names).toContain('scopes');
    expect(names).toHaveLength(10);
  });
});

describe('curl examples', () => {
  it('quotes for POSIX shells and names path parameters as variables', () => {
    expect(shellQuote("Larkspur's wire")).toBe("'Larkspur'\\''s wire'");
    expect(shellVariable('versionId')).toBe('$VERSION_ID');
    expect(shellVariable('slug')).toBe('$SLUG');
  });

  it('writes a token request with the body example', () => {
    expect(curlExample(doc, 'post', '/datasets')).toBe([
      'curl -X POST "$OHMSTEAD/api/v1/datasets" \\',
      '  -H "Authorization: Bearer $OHMSTEAD_TOKEN" \\',
      '  -H "Content-Type: application/json" \\',
      "  -d '{",
      '    "group": "larkspur-cryogenic",',
      '    "title": "Resistivity of a drawn copper wire from 2 K to 300 K"',
      "  }'",
    ].join('\n'));
    expect(curlExample(doc, 'patch', '/files/{fileId}')).toContain(`-d '{"role":"processed"}'`);
  });

  it('saves packages to a file, follows the redirect, and reads whole records from a file', () => {
    expect(curlExample(doc, 'get', '/versions/{versionId}/package')).toBe('curl -L -OJ "$OHMSTEAD/api/v1/versions/$VERSION_ID/package" \\\n  -H "Authorization: Bearer $OHMSTEAD_TOKEN"');
    expect(curlExample(doc, 'put', '/versions/{versionId}/metadata')).toContain('--data @record.json');
    expect(curlExample(doc, 'get', '/versions/{versionId}/citation')).toContain('/citation?format=bibtex"');
    expect(curlExample(doc, 'get', '/tokens')).toContain('-b "next-auth.session-token=$SESSION_COOKIE"');
    expect(curlExample(doc, 'get', '/openapi.json')).toBe('curl "$OHMSTEAD/api/v1/openapi.json"');
  });
});

describe('the page model', () => {
  const tags = apiPageModel(doc, OPERATIONS);

  it('has one section per tag in use, holding every operation once', () => {
    expect(tags.map((t) => t.name)).toEqual(['Datasets', 'Files', 'Review and publishing', 'Reviewer links', 'Search and reuse', 'Groups', 'Audit log', 'API tokens', 'About the API']);
    expect(tags.flatMap((t) => t.operations).length).toBe(OPERATIONS.length);
  });

  it('describes access, answers and refusals of publishing', () => {
    const publish = tags.find((t) => t.name === 'Review and publishing')!.operations.find((o) => o.path === '/versions/{versionId}/publish')!;
    expect(publish.access).toEqual({ kind: 'required', scope: 'publish', text: 'A token with scope publish, or a signed-in browser session.' });
    expect(publish.responses).toEqual([{ status: '200', description: 'Published.', body: 'VersionPublished (JSON)' }]);
    expect(publish.errors.map((e) => e.status)).toEqual(['401', '403', '404', '409', '413', '422', '429', '500']);
    expect(publish.errors.find((e) => e.status === '429')?.description).toMatch(/^Too many requests: 600 a minute per token/);
    expect(publish.body?.fields.map((f) => f.name)).toEqual(['embargoUntil']);
  });

  it('lists audit query parameters from the audit-query schema', () => {
    const audit = tags.find((t) => t.name === 'Audit log')!.operations[0];
    expect(audit.params.map((p) => p.name)).toEqual(['group', 'action', 'actor', 'targetType', 'targetId', 'from', 'to', 'page', 'pageSize']);
    expect(audit.params.find((p) => p.name === 'from')).toMatchObject({ location: 'query', type: 'text (date)', required: false });
  });
});

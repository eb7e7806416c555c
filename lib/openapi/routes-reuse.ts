// Operations for reuse (the compare basket and curves), API tokens, and this document itself.
import type { OperationSpec } from './types';

const R = 'schemas/api/responses/';

export const REUSE_OPERATIONS: OperationSpec[] = [
  {
    method: 'get', path: '/search', operationId: 'searchPublished', tag: 'Search and reuse', auth: 'optional',
    summary: 'Search published datasets',
    description: 'Free text over titles, descriptions, keywords, materials (formula spellings tolerated), creators and groups, with facets counted over the matches, range filters (tMin/tMax in K, bMax in T, fMin/fMax in Hz), sort and paging. Drafts, versions in review and withdrawn versions never appear; embargoed ones do, marked embargoed. Repeat a facet key to select several values.',
    query: { schema: 'schemas/api/search-query.schema.json' },
    responses: [{ status: 200, description: 'One page of results with facet counts.', schema: `${R}search-result.schema.json` }],
    errors: { 400: 'A malformed query: unknown key, wrong type, inverted range or a page beyond the limit.' },
  },
  {
    method: 'get', path: '/versions/{versionId}/package', operationId: 'downloadPackage', tag: 'Search and reuse', auth: 'optional',
    summary: 'Download a version as a package',
    description: 'A zip holding a BagIt bag: every file with its SHA-256 manifest, the record, a README and CITATION.cff. Streamed as it is built, or, once a published version\'s package is cached, a 302 to a presigned address valid for 5 minutes (follow it without your Authorization header, as curl -L and requests do for another host or port). A stored file that cannot be read breaks the transfer rather than give a short zip. HEAD answers the headers only.',
    responses: [
      { status: 200, description: 'The package.', content: { 'application/zip': {} }, headers: { 'Content-Disposition': { description: 'attachment; the file name is made from the DOI.', schema: { type: 'string' } } } },
      { status: 302, description: 'The cached package, at a presigned storage address.', headers: { Location: { description: 'Valid for 5 minutes.', schema: { type: 'string', format: 'uri' } } } },
    ],
    errors: { 403: 'Not yet (embargo) or not for you; withdrawn versions only for the site admin.', 404: 'No such version.', 503: 'Object storage is not reachable.' },
  },
  {
    method: 'get', path: '/compare/items', operationId: 'getCompareBasket', tag: 'Search and reuse', auth: 'required',
    summary: 'Read your compare basket',
    description: 'Your saved curves, each checked for access now; ones you can no longer see are listed with the reason.',
    responses: [{ status: 200, description: 'The basket.', schema: `${R}compare-basket.schema.json` }],
  },
  {
    method: 'post', path: '/compare/items', operationId: 'addCompareItems', tag: 'Search and reuse', auth: 'required',
    summary: 'Add curves to your compare basket',
    description: 'One curve (a version alone takes its main curve; x and y name another), or { items: [...] } to merge several, e.g. a browser\'s basket on sign-in. A batch adds what it can and lists the rest in rejected.',
    body: { schema: 'schemas/api/compare-items.schema.json', required: true, example: { versionId: '0b6f3e2a-8c1d-4e5f-9a7b-2c3d4e5f6a7b', x: 'T', y: 'R' } },
    responses: [
      { status: 201, description: 'At least one curve was added.', schema: `${R}compare-items-added.schema.json` },
      { status: 200, description: 'Every curve was in the basket already (or rejected).', schema: `${R}compare-items-added.schema.json` },
    ],
    errors: {
      403: 'You may not see this version\'s curves.', 404: 'No such version, file or curve.', 409: 'The basket is full.', 413: 'The body is over 64 KiB.',
      422: 'Malformed reference, or the version has no analysed curve yet.',
    },
  },
  {
    method: 'delete', path: '/compare/items', operationId: 'removeCompareItems', tag: 'Search and reuse', auth: 'required',
    summary: 'Remove curves from your compare basket',
    query: [
      { name: 'id', description: 'The basket item to remove.', schema: { type: 'string', format: 'uuid' } },
      { name: 'all', description: 'true empties the basket.', schema: { enum: ['true'] } },
    ],
    responses: [{ status: 200, description: 'How many were removed.', schema: `${R}compare-items-removed.schema.json` }],
    errors: { 404: 'This curve is not in your basket.', 422: 'Give one of id or all.' },
  },
  {
    method: 'get', path: '/compare/curves', operationId: 'resolveCompareCurves', tag: 'Search and reuse', auth: 'optional',
    summary: 'Resolve curves to plot',
    description: 'Turns a list of curve references (e.g. a basket kept in a browser) into plottable previews, for whoever asks; curves the caller may not see are listed with the reason.',
    query: [{
      name: 'curves', description: 'A JSON array of { versionId?, fileId?, x?, y? } (at most the basket size).',
      schema: { type: 'string', maxLength: 8192 }, example: '[{"versionId":"0b6f3e2a-8c1d-4e5f-9a7b-2c3d4e5f6a7b"}]',
    }],
    responses: [{ status: 200, description: 'The curves.', schema: `${R}compare-curves.schema.json` }],
    errors: { 422: 'The curves parameter is not a JSON array of references.' },
  },
  {
    method: 'get', path: '/tokens', operationId: 'listApiTokens', tag: 'API tokens', auth: 'session',
    summary: 'List your API tokens',
    description: 'Never the secrets. Browser session only: a token cannot list tokens.',
    responses: [{ status: 200, description: 'Your tokens, newest first.', schema: `${R}api-token-list.schema.json` }],
    errors: { 403: 'Called with an API token.' },
  },
  {
    method: 'post', path: '/tokens', operationId: 'createApiToken', tag: 'API tokens', auth: 'session',
    summary: 'Create an API token',
    description: 'The secret is in this answer only; Ohmstead keeps its SHA-256. Usually done at /settings/tokens. Browser session only.',
    body: { schema: 'schemas/api/create-api-token.schema.json', required: true, example: { name: 'cryostat PC upload script', scopes: ['deposit'], expiresInDays: 90 } },
    responses: [{ status: 201, description: 'The token with its secret.', schema: `${R}api-token-created.schema.json` }],
    errors: { 403: 'Called with an API token.', 409: 'You already have 50 working tokens.', 413: 'The body is over 8 KiB.', 422: 'Name, scopes or expiry are malformed.' },
  },
  {
    method: 'delete', path: '/tokens/{tokenId}', operationId: 'revokeApiToken', tag: 'API tokens', auth: 'session',
    summary: 'Revoke an API token',
    description: 'It stops working at once. Browser session only.',
    responses: [{ status: 200, description: 'The token, now revoked.', schema: `${R}api-token-result.schema.json` }],
    errors: { 403: 'Called with an API token.', 404: 'No such token among yours.' },
  },
  {
    method: 'get', path: '/openapi.json', operationId: 'getOpenApiDocument', tag: 'About the API', auth: 'none',
    summary: 'This OpenAPI 3.1 document',
    description: 'Built from the JSON Schemas the routes validate with. Cached for 5 minutes; send If-None-Match with the ETag to get 304.',
    responses: [
      { status: 200, description: 'The document.', content: { 'application/json': { schema: { type: 'object', required: ['openapi'], properties: { openapi: { type: 'string' } } } } } },
      { status: 304, description: 'Unchanged since the ETag you sent.' },
    ],
  },
];

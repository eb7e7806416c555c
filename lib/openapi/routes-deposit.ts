// Operations for depositing: datasets, versions, the measurement record, uploads and files.
import type { OperationSpec } from './types';

const R = 'schemas/api/responses/';
const ETAG_HEADER = { description: 'The file\'s SHA-256 in quotes.', schema: { type: 'string' } };
const DISPOSITION_HEADER = { description: 'attachment with the file name.', schema: { type: 'string' } };
const EXAMPLE_SHA256 = '3f1c9d0b5e7a2486c1d4f8e0a9b7c6d5e4f3a2b1c0d9e8f7a6b5c4d3e2f1a0b9';

export const DEPOSIT_OPERATIONS: OperationSpec[] = [
  {
    method: 'post', path: '/datasets', operationId: 'createDataset', tag: 'Datasets', auth: 'required',
    summary: 'Start a dataset',
    description: 'Creates a dataset in one of your groups with draft version 1, and reserves its version and all-versions DOIs. Members, curators and owners of the group may start one.',
    body: { schema: 'schemas/api/create-dataset.schema.json', required: true, example: { group: 'larkspur-cryogenic', title: 'Resistivity of a drawn copper wire from 2 K to 300 K' } },
    responses: [{ status: 201, description: 'The dataset and its first draft version.', schema: `${R}created-dataset.schema.json` }],
    errors: { 403: 'You are not in this group.', 404: 'There is no group with this slug.', 413: 'The body is over 64 KiB.', 422: 'The group or title is missing or too long.' },
  },
  {
    method: 'get', path: '/drafts', operationId: 'listDrafts', tag: 'Datasets', auth: 'required',
    summary: 'List your drafts',
    description: 'Drafts of every group you belong to, newest first; any depositor of a group may edit its drafts.',
    responses: [{ status: 200, description: 'The drafts.', schema: `${R}draft-list.schema.json` }],
  },
  {
    method: 'get', path: '/versions/{versionId}', operationId: 'getVersion', tag: 'Datasets', auth: 'optional',
    summary: 'Read a version',
    description: 'The record, what the schema says about it, the files and the actions you may take now. Published versions are public; drafts and versions in review only for their group.',
    responses: [{ status: 200, description: 'The version.', schema: `${R}version-view.schema.json` }],
    errors: { 403: 'You may not see this version.', 404: 'No such version (hidden versions answer the same).' },
  },
  {
    method: 'put', path: '/versions/{versionId}/metadata', operationId: 'putMetadata', tag: 'Datasets', auth: 'required',
    summary: 'Save the measurement record',
    description: 'Stores the draft\'s record exactly as sent, even when incomplete, and reports what is still missing (complete: false). Values of the wrong form are saved too but answered with 422 and details.saved = true, so nothing typed is lost. Submitting needs a complete record.',
    body: { schema: 'schemas/transport-dataset.schema.json', required: true, description: 'The whole record (a draft may leave fields out). Up to 1 MiB.' },
    responses: [{ status: 200, description: 'Saved; complete says whether it passes the whole schema.', schema: `${R}metadata-saved.schema.json` }],
    errors: {
      403: 'You may not edit this version.', 404: 'No such version.', 409: 'The version stopped being a draft meanwhile.', 413: 'The record is over the size limit; nothing was saved.',
      422: 'Saved, but some fields have wrong values (details.fieldErrors), or the body is not a JSON object (nothing saved).',
    },
  },
  {
    method: 'post', path: '/versions/{versionId}/new-version', operationId: 'createNewVersion', tag: 'Datasets', auth: 'required',
    summary: 'Start a new version',
    description: 'From the dataset\'s latest published version: a draft with its record and files, and a new version DOI. No body.',
    responses: [{ status: 201, description: 'The new draft.', schema: `${R}new-version.schema.json` }],
    errors: { 403: 'You may not start a version here (only group depositors, from the latest published version).', 404: 'No such version.', 409: 'A newer draft of this dataset was started meanwhile.' },
  },
  {
    method: 'post', path: '/versions/{versionId}/uploads', operationId: 'beginUpload', tag: 'Files', auth: 'required',
    summary: 'Begin an upload',
    description: 'Announces one file of a draft with its size and SHA-256, and answers with a presigned PUT URL per part. PUT each part\'s bytes to its URL (no Authorization header; keep each answer\'s ETag), then complete. A pending upload of the same name is replaced.',
    body: { schema: 'schemas/api/begin-upload.schema.json', required: true, example: { name: 'LCL-Cu-W07_RT.csv', sizeBytes: 183204, sha256: EXAMPLE_SHA256, role: 'raw', mediaType: 'text/csv' } },
    responses: [{ status: 201, description: 'Where to send the parts.', schema: `${R}upload-started.schema.json` }],
    errors: {
      403: 'You may not edit this version.', 404: 'No such version.', 409: 'A verified file of this name is already in the version.',
      413: 'The file is over the size limit or the group\'s storage quota.', 422: 'A field is missing or malformed, or the file name is not allowed.', 503: 'Object storage is not reachable; try again.',
    },
  },
  {
    method: 'get', path: '/uploads/{fileId}', operationId: 'getUploadStatus', tag: 'Files', auth: 'required',
    summary: 'Resume an upload',
    description: 'Which parts storage already holds with the right size, and fresh URLs for the missing ones.',
    responses: [{ status: 200, description: 'Where the upload stands.', schema: `${R}upload-status.schema.json` }],
    errors: { 403: 'You may not edit this version.', 404: 'No such file.', 503: 'Object storage is not reachable.' },
  },
  {
    method: 'delete', path: '/uploads/{fileId}', operationId: 'cancelUpload', tag: 'Files', auth: 'required',
    summary: 'Cancel an upload',
    description: 'Stops an upload in progress and deletes its staged parts.',
    responses: [{ status: 204, description: 'Cancelled.' }],
    errors: { 403: 'You may not edit this version.', 404: 'No such file.', 409: 'The file is already verified; remove it with DELETE /files/{fileId}.', 503: 'Object storage is not reachable.' },
  },
  {
    method: 'post', path: '/uploads/{fileId}/complete', operationId: 'completeUpload', tag: 'Files', auth: 'required',
    summary: 'Complete an upload',
    description: 'Streams the staged parts through SHA-256 and compares size and digest with what was declared. A match stores the file once under its digest and queues text files for analysis; a difference keeps nothing. The body may be empty (the server lists what arrived) or carry the ETags seen. Completing twice answers the verified file again.',
    body: { schema: 'schemas/api/complete-upload.schema.json', required: false, example: { parts: [{ partNumber: 1, etag: '"9b2cf535f27731c974343645a3985328"' }] } },
    responses: [{ status: 200, description: 'The verified file.', schema: `${R}file-result.schema.json` }],
    errors: {
      403: 'You may not edit this version.', 404: 'No such file.', 409: 'Parts are missing or changed (details.missingParts), or the upload can no longer be completed.',
      422: 'Size or SHA-256 differ from what was declared (details.declaredSha256, actualSha256); nothing was kept.', 503: 'Object storage is not reachable; the upload stays resumable.',
    },
  },
  {
    method: 'patch', path: '/files/{fileId}', operationId: 'updateFile', tag: 'Files', auth: 'required',
    summary: 'Change a file\'s role',
    body: { schema: 'schemas/api/update-file.schema.json', required: true, example: { role: 'processed' } },
    responses: [{ status: 200, description: 'The file.', schema: `${R}file-result.schema.json` }],
    errors: { 403: 'You may not edit this version.', 404: 'No such file.', 422: 'Unknown role.' },
  },
  {
    method: 'delete', path: '/files/{fileId}', operationId: 'removeFile', tag: 'Files', auth: 'required',
    summary: 'Remove a file from a draft',
    description: 'Its content is deleted when no other version uses the same bytes.',
    responses: [{ status: 204, description: 'Removed.' }],
    errors: { 403: 'You may not edit this version.', 404: 'No such file.' },
  },
  {
    method: 'get', path: '/files/{fileId}/download', operationId: 'downloadFile', tag: 'Files', auth: 'optional',
    summary: 'Download a file',
    description: 'The file\'s bytes, streamed from storage, for whoever may download the version\'s files now (published and not under embargo, or the group). One byte range (bytes=a-b, a-, -n) answers 206; several ranges the whole file. The ETag is the quoted SHA-256. HEAD answers the headers only.',
    responses: [
      { status: 200, description: 'The whole file, in its own media type.', content: { 'application/octet-stream': {} }, headers: { ETag: ETAG_HEADER, 'Content-Disposition': DISPOSITION_HEADER } },
      { status: 206, description: 'The requested byte range.', content: { 'application/octet-stream': {} }, headers: { 'Content-Range': { description: 'bytes start-end/size', schema: { type: 'string' } }, ETag: ETAG_HEADER } },
      { status: 304, description: 'Unchanged: If-None-Match named this file\'s ETag.' },
      { status: 416, description: 'The range is outside the file.', content: { 'text/plain': { schema: { type: 'string' } } } },
    ],
    errors: { 403: 'Not yet (embargo) or not for you; withdrawn versions only for the site admin.', 404: 'No such file.', 503: 'Object storage is not reachable.' },
  },
  {
    method: 'get', path: '/files/{fileId}/analysis', operationId: 'getFileAnalysis', tag: 'Files', auth: 'optional',
    summary: 'Read a file\'s analysis',
    description: 'State and progress of the analysis worker, and once done the summary: columns, sweep, derived values (resistivity, sheet resistance, carrier density, mobility, RRR…), quality flags and curve previews.',
    responses: [{ status: 200, description: 'The analysis.', schema: `${R}file-analysis.schema.json` }],
    errors: { 403: 'You may not see this version.', 404: 'No such file.' },
  },
  {
    method: 'get', path: '/files/{fileId}/curve', operationId: 'getFullCurve', tag: 'Files', auth: 'optional',
    summary: 'Read one curve at full resolution',
    description: 'Every point of the curve the analysis names (x and y are column names from it), converted to SI, streamed as JSON.',
    query: [
      { name: 'x', required: true, description: 'The x column, as in the analysis previews.', schema: { type: 'string', minLength: 1 }, example: 'T' },
      { name: 'y', required: true, description: 'The y column.', schema: { type: 'string', minLength: 1 }, example: 'R' },
    ],
    responses: [{ status: 200, description: 'The curve.', schema: `${R}full-curve.schema.json` }],
    errors: {
      403: 'You may not see this version\'s curves (e.g. under embargo).', 404: 'No such file, or the analysis has no such curve.', 409: 'The file no longer yields this curve.',
      413: 'Over 2 million points; download the file instead.', 422: 'x or y is missing.', 503: 'Object storage is not reachable.',
    },
  },
];

// Operations for review and publication: the version transitions, citations, DataCite records and reviewer links.
import type { OperationSpec } from './types';

const R = 'schemas/api/responses/';
const STATE_CHANGED = 'The version is in another state now (details.state); nothing was changed.';
const TEXT = { type: 'string' };

export const PUBLISHING_OPERATIONS: OperationSpec[] = [
  {
    method: 'post', path: '/versions/{versionId}/submit', operationId: 'submitVersion', tag: 'Review and publishing', auth: 'required',
    summary: 'Submit a draft for review',
    description: 'Needs a complete record and no unfinished uploads. The group\'s curators and owners are told by e-mail. An embargo date may be requested; the curator decides.',
    body: { schema: 'schemas/api/submit-version.schema.json', required: false, example: { embargoUntil: null } },
    responses: [{ status: 200, description: 'In review.', schema: `${R}version-submitted.schema.json` }],
    errors: { 403: 'You may not submit this version.', 404: 'No such version.', 409: `${STATE_CHANGED} Or uploads are unfinished.`, 413: 'The body is over 64 KiB.', 422: 'The record is incomplete, or the embargo date is not a day after today within 5 years.' },
  },
  {
    method: 'post', path: '/versions/{versionId}/return', operationId: 'returnVersion', tag: 'Review and publishing', auth: 'required',
    summary: 'Return a version to draft',
    description: 'Curators and owners send a version in review back to its authors with a comment (e-mailed to them).',
    body: { schema: 'schemas/api/return-version.schema.json', required: true, example: { comment: 'Please give the sample thickness and the excitation current.' } },
    responses: [{ status: 200, description: 'Back in draft.', schema: `${R}version-returned.schema.json` }],
    errors: { 403: 'Only the group\'s curators and owners return versions.', 404: 'No such version.', 409: STATE_CHANGED, 413: 'The body is over 64 KiB.', 422: 'The comment is missing or too long.' },
  },
  {
    method: 'post', path: '/versions/{versionId}/publish', operationId: 'publishVersion', tag: 'Review and publishing', auth: 'required',
    summary: 'Publish a version',
    description: 'Curators and owners publish a version in review: the landing page goes public, the DOI is registered through the outbox (retried until the agency answers, never twice) and the authors are told. embargoUntil keeps the files with the group until that day; omit it to keep the date the authors asked for.',
    body: { schema: 'schemas/api/publish-version.schema.json', required: false, example: { embargoUntil: '2027-06-30' } },
    responses: [{ status: 200, description: 'Published.', schema: `${R}version-published.schema.json` }],
    errors: { 403: 'Only the group\'s curators and owners publish (a token needs the publish scope).', 404: 'No such version.', 409: `${STATE_CHANGED} Or uploads are unfinished.`, 413: 'The body is over 64 KiB.', 422: 'The record is incomplete, or the embargo date is out of range.' },
  },
  {
    method: 'post', path: '/versions/{versionId}/withdraw', operationId: 'withdrawVersion', tag: 'Review and publishing', auth: 'required',
    summary: 'Withdraw a published version',
    description: 'The landing page becomes a tombstone with the reason; the DOI keeps resolving to it and the files are no longer served.',
    body: { schema: 'schemas/api/withdraw-version.schema.json', required: true, example: { reason: 'The thermometer calibration was wrong above 200 K; version 2 has corrected data.' } },
    responses: [{ status: 200, description: 'Withdrawn.', schema: `${R}version-withdrawn.schema.json` }],
    errors: { 403: 'Only the group\'s curators and owners withdraw.', 404: 'No such version.', 409: STATE_CHANGED, 413: 'The body is over 64 KiB.', 422: 'The reason is missing or too long.' },
  },
  {
    method: 'get', path: '/versions/{versionId}/citation', operationId: 'getCitation', tag: 'Review and publishing', auth: 'optional',
    summary: 'Cite a version',
    description: 'As plain text, BibTeX, RIS or CSL-JSON, for whoever may see the version.',
    query: [{ name: 'format', description: 'text (the default), bibtex, ris or csl-json.', schema: { enum: ['text', 'bibtex', 'ris', 'csl-json'] }, example: 'bibtex' }],
    responses: [{
      status: 200, description: 'The citation in the media type of its format.',
      content: {
        'text/plain': { schema: TEXT }, 'application/x-bibtex': { schema: TEXT }, 'application/x-research-info-systems': { schema: TEXT },
        'application/vnd.citationstyles.csl+json': { schema: { type: 'array', items: { type: 'object' } } },
      },
    }],
    errors: { 403: 'You may not see this version.', 404: 'No such version.', 409: 'The version has no DOI yet.', 422: 'Unknown format.' },
  },
  {
    method: 'get', path: '/versions/{versionId}/datacite', operationId: 'getDataCiteRecord', tag: 'Review and publishing', auth: 'optional',
    summary: 'Read the DataCite record',
    description: 'DataCite Metadata Schema 4.7 as XML, or as the agency\'s JSON:API "dois" resource. Drafts and versions in review get a preview (meta.preview).',
    query: [{ name: 'format', description: 'json (the default) or xml.', schema: { enum: ['json', 'xml'] }, example: 'xml' }],
    responses: [{
      status: 200, description: 'The record.', schema: `${R}datacite-document.schema.json`, schemaMediaType: 'application/vnd.api+json',
      content: { 'application/xml': { schema: TEXT } },
    }],
    errors: { 403: 'You may not see this version.', 404: 'No such version.', 409: 'The version has no DOI yet.', 422: 'Unknown format.' },
  },
  {
    method: 'post', path: '/versions/{versionId}/reviewer-links', operationId: 'createReviewerLink', tag: 'Reviewer links', auth: 'required',
    summary: 'Create a reviewer link',
    description: 'A private link that lets a referee read this version (and download its files) until it expires or is revoked, optionally without authors and group. The token is in this answer only.',
    body: { schema: 'schemas/api/create-reviewer-link.schema.json', required: true, example: { label: 'Referee 2, manuscript APL-4471', expiresAt: '2027-03-31T17:00:00Z', anonymous: true } },
    responses: [{ status: 201, description: 'The link, its token and its URL.', schema: `${R}reviewer-link-created.schema.json` }],
    errors: { 403: 'Only the group\'s members manage its links.', 404: 'No such version.', 413: 'The body is too large.', 422: 'The label is missing, or the expiry is not 1 hour to 1 year ahead.' },
  },
  {
    method: 'get', path: '/versions/{versionId}/reviewer-links', operationId: 'listReviewerLinks', tag: 'Reviewer links', auth: 'required',
    summary: 'List a version\'s reviewer links',
    responses: [{ status: 200, description: 'The links with their use counts.', schema: `${R}reviewer-link-list.schema.json` }],
    errors: { 403: 'Only the group\'s members see its links.', 404: 'No such version.' },
  },
  {
    method: 'get', path: '/versions/{versionId}/reviewer-links/access-log', operationId: 'getReviewerLinkAccessLog', tag: 'Reviewer links', auth: 'required',
    summary: 'Read the reviewer links\' access log',
    description: 'When each link was used and for what, newest first; never by whom. For the group\'s curators and owners.',
    responses: [{ status: 200, description: 'The events.', schema: `${R}link-access-log.schema.json` }],
    errors: { 403: 'Only the group\'s curators and owners see the log.', 404: 'No such version.' },
  },
  {
    method: 'delete', path: '/reviewer-links/{linkId}', operationId: 'revokeReviewerLink', tag: 'Reviewer links', auth: 'required',
    summary: 'Revoke a reviewer link',
    description: 'The link stops working at once. Revoking again changes nothing.',
    responses: [{ status: 200, description: 'The link, now revoked.', schema: `${R}reviewer-link-result.schema.json` }],
    errors: { 403: 'Only the group\'s members manage its links.', 404: 'No such link.' },
  },
  {
    method: 'post', path: '/reviewer-links/{linkId}/send', operationId: 'sendReviewerLink', tag: 'Reviewer links', auth: 'required',
    summary: 'E-mail a reviewer link',
    description: 'Sends the link to one referee address, which is used for this message only and never stored. Needs the token from the creation answer.',
    body: { schema: 'schemas/api/send-reviewer-link.schema.json', required: true, example: { email: 'referee@university.example', token: 'Qm9yZWFsaXMtcmV2aWV3LWxpbmstZXhhbXBsZS10b2s', message: 'The data behind Figure 3 of our manuscript.' } },
    responses: [
      { status: 200, description: 'The mail server took the message.', schema: `${R}reviewer-link-sent.schema.json` },
      { status: 202, description: 'The mail waits in the outbox and will be retried.', schema: `${R}reviewer-link-sent.schema.json` },
    ],
    errors: { 403: 'Only the group\'s members send its links.', 404: 'No such link.', 409: 'The link has expired or was revoked.', 413: 'The body is too large.', 422: 'Bad address, wrong token, or the note is too long.', 429: 'This link was e-mailed 20 times in the last hour.' },
  },
];

// Every JSON Schema the API reads or answers with, by file: the OpenAPI document embeds these objects as they are
// (tests/unit/openapi checks that every file under schemas/api/ is listed here).
import transportDatasetSchema from '@/schemas/transport-dataset.schema.json';
import answerInvitationSchema from '@/schemas/api/answer-invitation.schema.json';
import auditQuerySchema from '@/schemas/api/audit-query.schema.json';
import beginUploadSchema from '@/schemas/api/begin-upload.schema.json';
import changeMemberRoleSchema from '@/schemas/api/change-member-role.schema.json';
import compareItemsSchema from '@/schemas/api/compare-items.schema.json';
import completeUploadSchema from '@/schemas/api/complete-upload.schema.json';
import createApiTokenSchema from '@/schemas/api/create-api-token.schema.json';
import createDatasetSchema from '@/schemas/api/create-dataset.schema.json';
import createGroupSchema from '@/schemas/api/create-group.schema.json';
import createInvitationSchema from '@/schemas/api/create-invitation.schema.json';
import createReviewerLinkSchema from '@/schemas/api/create-reviewer-link.schema.json';
import publishVersionSchema from '@/schemas/api/publish-version.schema.json';
import returnVersionSchema from '@/schemas/api/return-version.schema.json';
import searchQuerySchema from '@/schemas/api/search-query.schema.json';
import sendReviewerLinkSchema from '@/schemas/api/send-reviewer-link.schema.json';
import submitVersionSchema from '@/schemas/api/submit-version.schema.json';
import transferOwnershipSchema from '@/schemas/api/transfer-ownership.schema.json';
import updateFileSchema from '@/schemas/api/update-file.schema.json';
import updateGroupSchema from '@/schemas/api/update-group.schema.json';
import withdrawVersionSchema from '@/schemas/api/withdraw-version.schema.json';
import apiTokenCreatedResponseSchema from '@/schemas/api/responses/api-token-created.schema.json';
import apiTokenListResponseSchema from '@/schemas/api/responses/api-token-list.schema.json';
import apiTokenResultResponseSchema from '@/schemas/api/responses/api-token-result.schema.json';
import apiTokenResponseSchema from '@/schemas/api/responses/api-token.schema.json';
import auditPageResponseSchema from '@/schemas/api/responses/audit-page.schema.json';
import compareBasketResponseSchema from '@/schemas/api/responses/compare-basket.schema.json';
import compareCurvesResponseSchema from '@/schemas/api/responses/compare-curves.schema.json';
import compareItemsAddedResponseSchema from '@/schemas/api/responses/compare-items-added.schema.json';
import compareItemsRemovedResponseSchema from '@/schemas/api/responses/compare-items-removed.schema.json';
import createdDatasetResponseSchema from '@/schemas/api/responses/created-dataset.schema.json';
import dataciteDocumentResponseSchema from '@/schemas/api/responses/datacite-document.schema.json';
import draftListResponseSchema from '@/schemas/api/responses/draft-list.schema.json';
import errorResponseSchema from '@/schemas/api/responses/error.schema.json';
import fileAnalysisResponseSchema from '@/schemas/api/responses/file-analysis.schema.json';
import fileResultResponseSchema from '@/schemas/api/responses/file-result.schema.json';
import fileResponseSchema from '@/schemas/api/responses/file.schema.json';
import fullCurveResponseSchema from '@/schemas/api/responses/full-curve.schema.json';
import groupCreatedResponseSchema from '@/schemas/api/responses/group-created.schema.json';
import groupDetailResponseSchema from '@/schemas/api/responses/group-detail.schema.json';
import groupListResponseSchema from '@/schemas/api/responses/group-list.schema.json';
import groupStorageResultResponseSchema from '@/schemas/api/responses/group-storage-result.schema.json';
import groupSummaryResponseSchema from '@/schemas/api/responses/group-summary.schema.json';
import invitationAcceptedResponseSchema from '@/schemas/api/responses/invitation-accepted.schema.json';
import invitationCreatedResponseSchema from '@/schemas/api/responses/invitation-created.schema.json';
import invitationDeclinedResponseSchema from '@/schemas/api/responses/invitation-declined.schema.json';
import invitationListResponseSchema from '@/schemas/api/responses/invitation-list.schema.json';
import invitationRevokedResponseSchema from '@/schemas/api/responses/invitation-revoked.schema.json';
import linkAccessLogResponseSchema from '@/schemas/api/responses/link-access-log.schema.json';
import memberListResponseSchema from '@/schemas/api/responses/member-list.schema.json';
import memberRemovedResponseSchema from '@/schemas/api/responses/member-removed.schema.json';
import memberRoleChangedResponseSchema from '@/schemas/api/responses/member-role-changed.schema.json';
import metadataSavedResponseSchema from '@/schemas/api/responses/metadata-saved.schema.json';
import newVersionResponseSchema from '@/schemas/api/responses/new-version.schema.json';
import ownershipTransferredResponseSchema from '@/schemas/api/responses/ownership-transferred.schema.json';
import responsePartsResponseSchema from '@/schemas/api/responses/response-parts.schema.json';
import reviewerLinkCreatedResponseSchema from '@/schemas/api/responses/reviewer-link-created.schema.json';
import reviewerLinkListResponseSchema from '@/schemas/api/responses/reviewer-link-list.schema.json';
import reviewerLinkResultResponseSchema from '@/schemas/api/responses/reviewer-link-result.schema.json';
import reviewerLinkSentResponseSchema from '@/schemas/api/responses/reviewer-link-sent.schema.json';
import reviewerLinkResponseSchema from '@/schemas/api/responses/reviewer-link.schema.json';
import uploadStartedResponseSchema from '@/schemas/api/responses/upload-started.schema.json';
import uploadStatusResponseSchema from '@/schemas/api/responses/upload-status.schema.json';
import versionPublishedResponseSchema from '@/schemas/api/responses/version-published.schema.json';
import versionReturnedResponseSchema from '@/schemas/api/responses/version-returned.schema.json';
import versionSubmittedResponseSchema from '@/schemas/api/responses/version-submitted.schema.json';
import searchResultResponseSchema from '@/schemas/api/responses/search-result.schema.json';
import versionViewResponseSchema from '@/schemas/api/responses/version-view.schema.json';
import versionWithdrawnResponseSchema from '@/schemas/api/responses/version-withdrawn.schema.json';

export type SchemaFile = readonly [path: string, schema: object];

export const SCHEMA_FILES: readonly SchemaFile[] = [
  ['schemas/transport-dataset.schema.json', transportDatasetSchema],
  ['schemas/api/answer-invitation.schema.json', answerInvitationSchema],
  ['schemas/api/audit-query.schema.json', auditQuerySchema],
  ['schemas/api/begin-upload.schema.json', beginUploadSchema],
  ['schemas/api/change-member-role.schema.json', changeMemberRoleSchema],
  ['schemas/api/compare-items.schema.json', compareItemsSchema],
  ['schemas/api/complete-upload.schema.json', completeUploadSchema],
  ['schemas/api/create-api-token.schema.json', createApiTokenSchema],
  ['schemas/api/create-dataset.schema.json', createDatasetSchema],
  ['schemas/api/create-group.schema.json', createGroupSchema],
  ['schemas/api/create-invitation.schema.json', createInvitationSchema],
  ['schemas/api/create-reviewer-link.schema.json', createReviewerLinkSchema],
  ['schemas/api/publish-version.schema.json', publishVersionSchema],
  ['schemas/api/return-version.schema.json', returnVersionSchema],
  ['schemas/api/search-query.schema.json', searchQuerySchema],
  ['schemas/api/send-reviewer-link.schema.json', sendReviewerLinkSchema],
  ['schemas/api/submit-version.schema.json', submitVersionSchema],
  ['schemas/api/transfer-ownership.schema.json', transferOwnershipSchema],
  ['schemas/api/update-file.schema.json', updateFileSchema],
  ['schemas/api/update-group.schema.json', updateGroupSchema],
  ['schemas/api/withdraw-version.schema.json', withdrawVersionSchema],
  ['schemas/api/responses/api-token-created.schema.json', apiTokenCreatedResponseSchema],
  ['schemas/api/responses/api-token-list.schema.json', apiTokenListResponseSchema],
  ['schemas/api/responses/api-token-result.schema.json', apiTokenResultResponseSchema],
  ['schemas/api/responses/api-token.schema.json', apiTokenResponseSchema],
  ['schemas/api/responses/audit-page.schema.json', auditPageResponseSchema],
  ['schemas/api/responses/compare-basket.schema.json', compareBasketResponseSchema],
  ['schemas/api/responses/compare-curves.schema.json', compareCurvesResponseSchema],
  ['schemas/api/responses/compare-items-added.schema.json', compareItemsAddedResponseSchema],
  ['schemas/api/responses/compare-items-removed.schema.json', compareItemsRemovedResponseSchema],
  ['schemas/api/responses/created-dataset.schema.json', createdDatasetResponseSchema],
  ['schemas/api/responses/datacite-document.schema.json', dataciteDocumentResponseSchema],
  ['schemas/api/responses/draft-list.schema.json', draftListResponseSchema],
  ['schemas/api/responses/error.schema.json', errorResponseSchema],
  ['schemas/api/responses/file-analysis.schema.json', fileAnalysisResponseSchema],
  ['schemas/api/responses/file-result.schema.json', fileResultResponseSchema],
  ['schemas/api/responses/file.schema.json', fileResponseSchema],
  ['schemas/api/responses/full-curve.schema.json', fullCurveResponseSchema],
  ['schemas/api/responses/group-created.schema.json', groupCreatedResponseSchema],
  ['schemas/api/responses/group-detail.schema.json', groupDetailResponseSchema],
  ['schemas/api/responses/group-list.schema.json', groupListResponseSchema],
  ['schemas/api/responses/group-storage-result.schema.json', groupStorageResultResponseSchema],
  ['schemas/api/responses/group-summary.schema.json', groupSummaryResponseSchema],
  ['schemas/api/responses/invitation-accepted.schema.json', invitationAcceptedResponseSchema],
  ['schemas/api/responses/invitation-created.schema.json', invitationCreatedResponseSchema],
  ['schemas/api/responses/invitation-declined.schema.json', invitationDeclinedResponseSchema],
  ['schemas/api/responses/invitation-list.schema.json', invitationListResponseSchema],
  ['schemas/api/responses/invitation-revoked.schema.json', invitationRevokedResponseSchema],
  ['schemas/api/responses/link-access-log.schema.json', linkAccessLogResponseSchema],
  ['schemas/api/responses/member-list.schema.json', memberListResponseSchema],
  ['schemas/api/responses/member-removed.schema.json', memberRemovedResponseSchema],
  ['schemas/api/responses/member-role-changed.schema.json', memberRoleChangedResponseSchema],
  ['schemas/api/responses/metadata-saved.schema.json', metadataSavedResponseSchema],
  ['schemas/api/responses/new-version.schema.json', newVersionResponseSchema],
  ['schemas/api/responses/ownership-transferred.schema.json', ownershipTransferredResponseSchema],
  ['schemas/api/responses/response-parts.schema.json', responsePartsResponseSchema],
  ['schemas/api/responses/reviewer-link-created.schema.json', reviewerLinkCreatedResponseSchema],
  ['schemas/api/responses/reviewer-link-list.schema.json', reviewerLinkListResponseSchema],
  ['schemas/api/responses/reviewer-link-result.schema.json', reviewerLinkResultResponseSchema],
  ['schemas/api/responses/reviewer-link-sent.schema.json', reviewerLinkSentResponseSchema],
  ['schemas/api/responses/reviewer-link.schema.json', reviewerLinkResponseSchema],
  ['schemas/api/responses/upload-started.schema.json', uploadStartedResponseSchema],
  ['schemas/api/responses/upload-status.schema.json', uploadStatusResponseSchema],
  ['schemas/api/responses/version-published.schema.json', versionPublishedResponseSchema],
  ['schemas/api/responses/version-returned.schema.json', versionReturnedResponseSchema],
  ['schemas/api/responses/version-submitted.schema.json', versionSubmittedResponseSchema],
  ['schemas/api/responses/search-result.schema.json', searchResultResponseSchema],
  ['schemas/api/responses/version-view.schema.json', versionViewResponseSchema],
  ['schemas/api/responses/version-withdrawn.schema.json', versionWithdrawnResponseSchema],
];

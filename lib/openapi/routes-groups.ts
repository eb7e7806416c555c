// Operations for groups (members, invitations, ownership, storage) and the audit log.
import type { OperationSpec } from './types';

const R = 'schemas/api/responses/';
const INVITATION_TOKEN = 'c2FsdG1hcnNoLWludml0YXRpb24tZXhhbXBsZS10b2s';
const NO_GROUP = 'There is no group with this slug.';

export const GROUP_OPERATIONS: OperationSpec[] = [
  {
    method: 'get', path: '/groups', operationId: 'listGroups', tag: 'Groups', auth: 'optional',
    summary: 'List groups',
    description: 'Every group, by name, with your role in each when signed in.',
    responses: [{ status: 200, description: 'The groups.', schema: `${R}group-list.schema.json` }],
  },
  {
    method: 'post', path: '/groups', operationId: 'createGroup', tag: 'Groups', auth: 'required',
    summary: 'Create a group',
    description: 'Any signed-in user may create a group and becomes its first owner.',
    body: {
      schema: 'schemas/api/create-group.schema.json', required: true,
      example: { name: 'Harrier Lane Cryogenics Group', slug: 'harrier-lane-cryo', institution: 'Northfell Institute of Technology (invented)', description: 'Thermal and electrical transport of wires below 4 K.' },
    },
    responses: [{ status: 201, description: 'The new group.', schema: `${R}group-created.schema.json` }],
    errors: { 409: 'The address (slug) is taken.', 413: 'The body is over 16 KiB.', 422: 'A field is missing or malformed.', 429: 'You created 10 groups in the last day.' },
  },
  {
    method: 'get', path: '/groups/{slug}', operationId: 'getGroup', tag: 'Groups', auth: 'optional',
    summary: 'Read a group',
    description: 'The group with its published datasets; its storage use and quota for its members and site admins.',
    responses: [{ status: 200, description: 'The group.', schema: `${R}group-detail.schema.json` }],
    errors: { 404: NO_GROUP },
  },
  {
    method: 'patch', path: '/groups/{slug}', operationId: 'setGroupQuota', tag: 'Groups', auth: 'required',
    summary: 'Change a group\'s storage quota',
    description: 'Site admins only. A quota below the current use stops new uploads; nothing is deleted.',
    body: { schema: 'schemas/api/update-group.schema.json', required: true, example: { storageQuotaBytes: 107374182400 } },
    responses: [{ status: 200, description: 'The storage use against the new quota.', schema: `${R}group-storage-result.schema.json` }],
    errors: { 403: 'Only site admins change quotas.', 404: NO_GROUP, 413: 'The body is over 4 KiB.', 422: 'The quota is out of range.' },
  },
  {
    method: 'get', path: '/groups/{slug}/members', operationId: 'listMembers', tag: 'Groups', auth: 'optional',
    summary: 'List members',
    description: 'Names, roles and ORCID iDs for everyone; e-mail addresses and join dates only for the group\'s members and site admins.',
    responses: [{ status: 200, description: 'The members.', schema: `${R}member-list.schema.json` }],
    errors: { 404: NO_GROUP },
  },
  {
    method: 'patch', path: '/groups/{slug}/members/{userId}', operationId: 'changeMemberRole', tag: 'Groups', auth: 'required',
    summary: 'Change a member\'s role',
    description: 'Owners and site admins. A group never has zero owners.',
    body: { schema: 'schemas/api/change-member-role.schema.json', required: true, example: { role: 'curator' } },
    responses: [{ status: 200, description: 'The member with the new role.', schema: `${R}member-role-changed.schema.json` }],
    errors: { 403: 'Only owners and site admins change roles.', 404: 'No such group or member.', 409: 'The group would be left without an owner.', 413: 'The body is over 4 KiB.', 422: 'Unknown role.' },
  },
  {
    method: 'delete', path: '/groups/{slug}/members/{userId}', operationId: 'removeMember', tag: 'Groups', auth: 'required',
    summary: 'Remove a member, or leave',
    description: 'Owners remove anyone; everyone may remove themselves. The last owner cannot leave.',
    responses: [{ status: 200, description: 'Removed.', schema: `${R}member-removed.schema.json` }],
    errors: { 403: 'Only owners and site admins remove others.', 404: 'No such group or member.', 409: 'The group would be left without an owner.' },
  },
  {
    method: 'post', path: '/groups/{slug}/transfer-ownership', operationId: 'transferOwnership', tag: 'Groups', auth: 'required',
    summary: 'Hand over ownership',
    description: 'An owner makes another member an owner and steps down to curator (or member) in one step.',
    body: { schema: 'schemas/api/transfer-ownership.schema.json', required: true, example: { userId: '6f1d2c3b-4a5e-4f60-8a7b-9c0d1e2f3a4b', formerOwnerRole: 'curator' } },
    responses: [{ status: 200, description: 'The new and the former owner.', schema: `${R}ownership-transferred.schema.json` }],
    errors: { 403: 'Only an owner hands over ownership.', 404: 'No such group or member.', 413: 'The body is over 4 KiB.', 422: 'The user id is malformed or your own.' },
  },
  {
    method: 'get', path: '/groups/{slug}/invitations', operationId: 'listInvitations', tag: 'Groups', auth: 'required',
    summary: 'List open invitations',
    description: 'For the group\'s curators and owners, and site admins.',
    responses: [{ status: 200, description: 'Pending and expired invitations.', schema: `${R}invitation-list.schema.json` }],
    errors: { 403: 'Only curators and owners see invitations.', 404: NO_GROUP },
  },
  {
    method: 'post', path: '/groups/{slug}/invitations', operationId: 'inviteMember', tag: 'Groups', auth: 'required',
    summary: 'Invite someone by e-mail',
    description: 'Mails a link valid for 14 days; inviting the same address again replaces the open invitation. Curators invite members and curators; owners any role.',
    body: { schema: 'schemas/api/create-invitation.schema.json', required: true, example: { email: 'new.member@larkspur.example', role: 'member' } },
    responses: [{ status: 201, description: 'Sent (or queued for sending).', schema: `${R}invitation-created.schema.json` }],
    errors: { 403: 'Only curators and owners invite.', 404: NO_GROUP, 409: 'The person is already a member.', 413: 'The body is over 4 KiB.', 422: 'Bad address, or a role you may not give.', 429: 'The group sent 50 invitations in the last hour.' },
  },
  {
    method: 'delete', path: '/groups/{slug}/invitations/{invitationId}', operationId: 'revokeInvitation', tag: 'Groups', auth: 'required',
    summary: 'Withdraw an invitation',
    description: 'The link stops working at once.',
    responses: [{ status: 200, description: 'Withdrawn.', schema: `${R}invitation-revoked.schema.json` }],
    errors: { 403: 'Only curators and owners withdraw invitations (owners for owner invitations).', 404: 'No open invitation with this id (answered or withdrawn already).' },
  },
  {
    method: 'post', path: '/invitations/accept', operationId: 'acceptInvitation', tag: 'Groups', auth: 'required',
    summary: 'Accept an invitation',
    description: 'As the account with the invited, verified address.',
    body: { schema: 'schemas/api/answer-invitation.schema.json', required: true, example: { token: INVITATION_TOKEN } },
    responses: [{ status: 200, description: 'You are in the group.', schema: `${R}invitation-accepted.schema.json` }],
    errors: { 403: 'The invitation is for another address.', 404: 'No such invitation.', 409: 'Already accepted, declined or expired (details.reason).', 413: 'The body is over 1 KiB.', 422: 'The token is malformed.' },
  },
  {
    method: 'post', path: '/invitations/decline', operationId: 'declineInvitation', tag: 'Groups', auth: 'optional',
    summary: 'Decline an invitation',
    description: 'The token alone is enough; no account is needed.',
    body: { schema: 'schemas/api/answer-invitation.schema.json', required: true, example: { token: INVITATION_TOKEN } },
    responses: [{ status: 200, description: 'Declined.', schema: `${R}invitation-declined.schema.json` }],
    errors: { 404: 'No such invitation.', 409: 'Already accepted, declined or expired.', 413: 'The body is over 1 KiB.', 422: 'The token is malformed.' },
  },
  {
    method: 'get', path: '/audit', operationId: 'listAuditEntries', tag: 'Audit log', auth: 'required',
    summary: 'Read the audit log',
    description: 'Sign-ins, role changes, publications, withdrawals, reviewer links and tokens, newest first. Curators and owners name their group; site admins may leave it out to see everything.',
    query: { schema: 'schemas/api/audit-query.schema.json' },
    responses: [{ status: 200, description: 'One page of entries.', schema: `${R}audit-page.schema.json` }],
    errors: { 403: 'Only curators, owners (their group) and site admins (all) see the log.', 404: NO_GROUP, 422: 'A filter is malformed, or the range ends before it starts.' },
  },
];

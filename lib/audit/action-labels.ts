// Plain words for the audit log's action names; an unknown action is shown by its name.

export const AUDIT_ACTION_LABELS: Readonly<Record<string, string>> = {
  'user.sign_up': 'Account created',
  'user.sign_in': 'Signed in',
  'user.sign_in_failed': 'Sign-in failed',
  'user.sign_in_throttled': 'Sign-in throttled',
  'user.sign_out': 'Signed out',
  'user.password_reset_requested': 'Password reset requested',
  'user.password_reset': 'Password reset',
  'token.created': 'API token created',
  'token.revoked': 'API token revoked',
  'group.create': 'Group created',
  'group.invitation_created': 'Invitation sent',
  'group.invitation_revoked': 'Invitation withdrawn',
  'group.invitation_accepted': 'Invitation accepted',
  'group.invitation_declined': 'Invitation declined',
  'group.member_role_changed': 'Role changed',
  'group.member_removed': 'Member removed',
  'group.member_left': 'Member left',
  'group.ownership_transferred': 'Ownership transferred',
  'group.quota_changed': 'Storage quota changed',
  'dataset.create': 'Dataset started',
  'version.create': 'New version started',
  'version.submit': 'Submitted for review',
  'version.return': 'Returned to draft',
  'version.publish': 'Published',
  'version.withdraw': 'Withdrawn',
  'file.upload': 'File uploaded',
  'file.remove': 'File removed',
  'reviewer_link.create': 'Reviewer link created',
  'reviewer_link.send': 'Reviewer link e-mailed',
  'reviewer_link.use': 'Reviewer link used',
  'reviewer_link.revoke': 'Reviewer link revoked',
};

export function auditActionLabel(action: string): string {
  return AUDIT_ACTION_LABELS[action] ?? action;
}

/** Who acted, in words, when no account is named (reviewer links never identify the reviewer). */
export const ACTOR_KIND_LABELS: Readonly<Record<string, string>> = {
  user: 'a user',
  reviewer: 'a reviewer link holder',
  token: 'an API token',
  system: 'Ohmstead itself',
  anonymous: 'someone without an account',
};

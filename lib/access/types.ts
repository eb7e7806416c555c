// Vocabulary of the access rules: who acts, on what, in which state. Pure types, no I/O.

export const SITE_ROLES = ['admin', 'user'] as const;
export type SiteRole = (typeof SITE_ROLES)[number];

export const GROUP_ROLES = ['owner', 'curator', 'member'] as const;
export type GroupRole = (typeof GROUP_ROLES)[number];

export const VERSION_STATES = ['draft', 'in_review', 'published', 'withdrawn'] as const;
export type VersionState = (typeof VERSION_STATES)[number];

export const ACTIONS = [
  'view_metadata',
  'view_curves',
  'download_files',
  'edit',
  'submit',
  'return_to_draft',
  'publish',
  'create_version',
  'withdraw',
  'manage_links',
  'view_access_log',
  'manage_members',
  'invite_members',
  'delete_draft',
] as const;
export type Action = (typeof ACTIONS)[number];

export type ReviewerLinkGrant = {
  versionId: string;
  expiresAt: Date;
  revokedAt: Date | null;
  /** Anonymous mode hides authors from the reviewer; it does not change what the link may do. */
  anonymous: boolean;
};

export type Actor =
  | { kind: 'anonymous' }
  | {
      kind: 'user';
      userId: string;
      siteRole: SiteRole;
      /** Role in the dataset's group, resolved by the server; absent when not a member. */
      groupRole?: GroupRole;
    }
  | { kind: 'reviewer'; link: ReviewerLinkGrant };

export type Resource = {
  versionId: string;
  state: VersionState;
  /** Files locked until 00:00 UTC of this date (stored as that instant); null = no embargo. */
  embargoUntil: Date | null;
  /** False when a newer version of the dataset exists; undefined means the server did not say. */
  isLatest?: boolean;
};

export const DENIAL_CODES = [
  'not_signed_in',
  'forbidden',
  'not_found',
  'embargoed',
  'link_expired',
  'link_revoked',
  'wrong_state',
] as const;
export type DenialCode = (typeof DENIAL_CODES)[number];

export type Denial = { allowed: false; reason: string; code: DenialCode };
export type Decision = { allowed: true } | Denial;

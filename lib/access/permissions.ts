// THE permission table: phase × action → who may. decide.ts only reads it.
import type { Action, GroupRole } from './types';

/** A row of the table. A signed-in actor holds several: 'user', plus its group role, plus 'admin'. */
export type Principal = 'anonymous' | 'user' | GroupRole | 'admin' | 'reviewer';
export const PRINCIPALS = ['anonymous', 'user', 'member', 'curator', 'owner', 'admin', 'reviewer'] as const satisfies readonly Principal[];

/** A version's state as access sees it: published splits on whether the embargo date is still ahead. */
export const PHASES = ['draft', 'in_review', 'published', 'embargoed', 'withdrawn'] as const;
export type Phase = (typeof PHASES)[number];

type Who = readonly Principal[];

const NOBODY: Who = [];
const EVERYONE: Who = PRINCIPALS;
/** Any depositor of the version's group. */
const GROUP: Who = ['member', 'curator', 'owner'];
/** Curators and owners: the group's data stewards. */
const STEWARDS: Who = ['curator', 'owner'];
/** Those who may look at unpublished or locked content: group, site admin (support), valid reviewer link. */
const INSIDERS: Who = [...GROUP, 'admin', 'reviewer'];
/** Stewards plus the site admin, who oversees groups and audit for the whole hub. */
const STEWARDS_AND_ADMIN: Who = [...STEWARDS, 'admin'];

// Group-level actions do not depend on the version's state; they are repeated in every phase.
const GROUP_ADMIN = {
  view_access_log: STEWARDS_AND_ADMIN, // members manage links but the use log is for stewards
  manage_members: ['owner', 'admin'], // only owners change roles; curators cannot demote owners
  invite_members: STEWARDS_AND_ADMIN, // curators may grow the group with plain members
} as const satisfies Partial<Record<Action, Who>>;

export const PERMISSIONS: Readonly<Record<Phase, Readonly<Record<Action, Who>>>> = {
  draft: {
    view_metadata: INSIDERS,
    view_curves: INSIDERS,
    download_files: INSIDERS,
    edit: GROUP,
    submit: GROUP,
    return_to_draft: NOBODY,
    publish: STEWARDS, // common practice: four-eyes; self-publish by members may become a group setting
    create_version: NOBODY, // the draft is already the open version
    withdraw: NOBODY,
    manage_links: GROUP, // common practice: authors send review links to referees
    delete_draft: GROUP,
    ...GROUP_ADMIN,
  },
  in_review: {
    view_metadata: INSIDERS,
    view_curves: INSIDERS,
    download_files: INSIDERS,
    edit: NOBODY, // frozen while curators read it; they return it to draft first
    submit: NOBODY,
    return_to_draft: STEWARDS,
    publish: STEWARDS,
    create_version: NOBODY,
    withdraw: NOBODY,
    manage_links: GROUP,
    delete_draft: NOBODY,
    ...GROUP_ADMIN,
  },
  published: {
    view_metadata: EVERYONE,
    view_curves: EVERYONE,
    download_files: EVERYONE,
    edit: NOBODY, // common practice: a version with a DOI never changes
    submit: NOBODY,
    return_to_draft: NOBODY,
    publish: NOBODY,
    create_version: GROUP,
    withdraw: STEWARDS_AND_ADMIN, // admin may take down e.g. on a legal request
    manage_links: GROUP,
    delete_draft: NOBODY,
    ...GROUP_ADMIN,
  },
  embargoed: {
    view_metadata: EVERYONE, // common practice: landing page, metadata and DOI public at once
    view_curves: INSIDERS, // curves are computed from the files, so showing them would leak the data
    download_files: INSIDERS,
    edit: NOBODY,
    submit: NOBODY,
    return_to_draft: NOBODY,
    publish: NOBODY,
    create_version: GROUP,
    withdraw: STEWARDS_AND_ADMIN,
    manage_links: GROUP, // referees of a follow-up paper still need links while files are locked
    delete_draft: NOBODY,
    ...GROUP_ADMIN,
  },
  withdrawn: {
    view_metadata: EVERYONE, // common practice: tombstone page, the DOI keeps resolving
    view_curves: ['admin'], // gone from view for everyone, the group too; admin keeps support access
    download_files: ['admin'],
    edit: NOBODY,
    submit: NOBODY,
    return_to_draft: NOBODY,
    publish: NOBODY,
    create_version: NOBODY, // a new version would copy references to withdrawn files
    withdraw: NOBODY,
    manage_links: NOBODY,
    delete_draft: NOBODY,
    ...GROUP_ADMIN,
  },
};

/** Extra condition on the resource for an action granted by the table. */
export const ACTION_REQUIREMENTS: Readonly<Partial<Record<Action, 'latest_version'>>> = {
  create_version: 'latest_version', // a new version always continues from the latest one
};

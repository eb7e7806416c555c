import type { Action } from './types';

/** Plain-language meaning of each action, for DEVELOPERS.md and tooltips. */
export const ACTION_DESCRIPTIONS: Readonly<Record<Action, string>> = {
  view_metadata: 'See the landing page: title, creators, description, sample and measurement cards, DOI and citation.',
  view_curves: 'See the interactive plots and derived-quantity tables, which are computed from the files.',
  download_files: 'Download single files or the checksummed zip package of the version.',
  edit: 'Change the metadata or add, replace and remove files of a draft.',
  submit: "Send a draft to the group's curators for review.",
  return_to_draft: 'Send a version under review back to its authors as a draft, with a comment.',
  publish: 'Make the version public and register its DOI, optionally with files under embargo.',
  create_version: "Start a new draft that copies the latest published version's metadata and file references.",
  withdraw: 'Take a published version down to a tombstone page; its DOI keeps resolving.',
  manage_links: 'Create, list, e-mail and revoke private reviewer links for the version.',
  view_access_log: 'See who opened reviewer links and who downloaded the files (reviewer identity never shown).',
  manage_members: "Change the group's members and their roles, including owners.",
  invite_members: 'Invite new people to the group by e-mail as members.',
  delete_draft: 'Delete a draft version that was never published.',
};

/** Verb phrase used inside refusal messages ("Your role does not allow you to …"). */
export const ACTION_LABELS: Readonly<Record<Action, string>> = {
  view_metadata: "view this version's details",
  view_curves: 'view the curves',
  download_files: 'download the files',
  edit: 'edit this version',
  submit: 'submit this version for review',
  return_to_draft: 'return this version to draft',
  publish: 'publish this version',
  create_version: 'start a new version',
  withdraw: 'withdraw this version',
  manage_links: 'manage reviewer links',
  view_access_log: 'view the access log',
  manage_members: "change the group's members and roles",
  invite_members: 'invite people to the group',
  delete_draft: 'delete this draft',
};

// Hand-written expectation for every (actor × state × action) cell; NOT derived from lib/access.
// Written from the rules in ../shared/design/product.md "Life of a dataset" / "Roles and access"
// and issues 2, 5 and 6. Codes: ok = allowed; nf not_found; ns not_signed_in; fb forbidden;
// em embargoed; ws wrong_state; le link_expired; lr link_revoked.
import type { Action, DenialCode } from '@/lib/access';

export type Short = 'ok' | 'nf' | 'ns' | 'fb' | 'em' | 'ws' | 'le' | 'lr';

export const CODE_OF: Readonly<Record<Exclude<Short, 'ok'>, DenialCode>> = {
  nf: 'not_found',
  ns: 'not_signed_in',
  fb: 'forbidden',
  em: 'embargoed',
  ws: 'wrong_state',
  le: 'link_expired',
  lr: 'link_revoked',
};

export const ACTOR_NAMES = [
  'anonymous',
  'signed-in user, no group role',
  'member',
  'curator',
  'owner',
  'site admin',
  'reviewer link (valid)',
  'reviewer link (expired)',
  'reviewer link (revoked)',
  'reviewer link (other version)',
] as const;
export type ActorName = (typeof ACTOR_NAMES)[number];

export const STATE_CASES = [
  'draft',
  'in_review',
  'published',
  'published, embargoed (date ahead)',
  'published, embargo 1 ms before 00:00 UTC',
  'published, embargo exactly 00:00 UTC',
  'withdrawn',
] as const;
export type StateCase = (typeof STATE_CASES)[number];

type Row = readonly [Short, Short, Short, Short, Short, Short, Short, Short, Short, Short];

//  columns:         anon  user  memb  cur   own   admin rev   revEx revRv revOt
const DRAFT: Record<Action, Row> = {
  view_metadata:   ['nf', 'nf', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  view_curves:     ['nf', 'nf', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  download_files:  ['nf', 'nf', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  edit:            ['nf', 'nf', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  submit:          ['nf', 'nf', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  return_to_draft: ['nf', 'nf', 'fb', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  publish:         ['nf', 'nf', 'fb', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  create_version:  ['nf', 'nf', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  withdraw:        ['nf', 'nf', 'fb', 'ws', 'ws', 'ws', 'fb', 'le', 'lr', 'nf'],
  manage_links:    ['nf', 'nf', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  view_access_log: ['nf', 'nf', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  manage_members:  ['nf', 'nf', 'fb', 'fb', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  invite_members:  ['nf', 'nf', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  delete_draft:    ['nf', 'nf', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
};

//  columns:         anon  user  memb  cur   own   admin rev   revEx revRv revOt
const IN_REVIEW: Record<Action, Row> = {
  view_metadata:   ['nf', 'nf', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  view_curves:     ['nf', 'nf', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  download_files:  ['nf', 'nf', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  edit:            ['nf', 'nf', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  submit:          ['nf', 'nf', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  return_to_draft: ['nf', 'nf', 'fb', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  publish:         ['nf', 'nf', 'fb', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  create_version:  ['nf', 'nf', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  withdraw:        ['nf', 'nf', 'fb', 'ws', 'ws', 'ws', 'fb', 'le', 'lr', 'nf'],
  manage_links:    ['nf', 'nf', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  view_access_log: ['nf', 'nf', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  manage_members:  ['nf', 'nf', 'fb', 'fb', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  invite_members:  ['nf', 'nf', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  delete_draft:    ['nf', 'nf', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
};

//  columns:         anon  user  memb  cur   own   admin rev   revEx revRv revOt
const PUBLISHED_OPEN: Record<Action, Row> = {
  view_metadata:   ['ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  view_curves:     ['ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  download_files:  ['ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  edit:            ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  submit:          ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  return_to_draft: ['ns', 'fb', 'fb', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  publish:         ['ns', 'fb', 'fb', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  create_version:  ['ns', 'fb', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  withdraw:        ['ns', 'fb', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  manage_links:    ['ns', 'fb', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  view_access_log: ['ns', 'fb', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  manage_members:  ['ns', 'fb', 'fb', 'fb', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  invite_members:  ['ns', 'fb', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  delete_draft:    ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
};

//  columns:         anon  user  memb  cur   own   admin rev   revEx revRv revOt
const PUBLISHED_LOCKED: Record<Action, Row> = {
  view_metadata:   ['ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  view_curves:     ['em', 'em', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  download_files:  ['em', 'em', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  edit:            ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  submit:          ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  return_to_draft: ['ns', 'fb', 'fb', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  publish:         ['ns', 'fb', 'fb', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  create_version:  ['ns', 'fb', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  withdraw:        ['ns', 'fb', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  manage_links:    ['ns', 'fb', 'ok', 'ok', 'ok', 'fb', 'fb', 'le', 'lr', 'nf'],
  view_access_log: ['ns', 'fb', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  manage_members:  ['ns', 'fb', 'fb', 'fb', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  invite_members:  ['ns', 'fb', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  delete_draft:    ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
};

//  columns:         anon  user  memb  cur   own   admin rev   revEx revRv revOt
const WITHDRAWN: Record<Action, Row> = {
  view_metadata:   ['ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'ok', 'le', 'lr', 'nf'],
  view_curves:     ['ws', 'ws', 'ws', 'ws', 'ws', 'ok', 'ws', 'le', 'lr', 'nf'],
  download_files:  ['ws', 'ws', 'ws', 'ws', 'ws', 'ok', 'ws', 'le', 'lr', 'nf'],
  edit:            ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  submit:          ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  return_to_draft: ['ns', 'fb', 'fb', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  publish:         ['ns', 'fb', 'fb', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  create_version:  ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  withdraw:        ['ns', 'fb', 'fb', 'ws', 'ws', 'ws', 'fb', 'le', 'lr', 'nf'],
  manage_links:    ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
  view_access_log: ['ns', 'fb', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  manage_members:  ['ns', 'fb', 'fb', 'fb', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  invite_members:  ['ns', 'fb', 'fb', 'ok', 'ok', 'ok', 'fb', 'le', 'lr', 'nf'],
  delete_draft:    ['ns', 'fb', 'ws', 'ws', 'ws', 'fb', 'fb', 'le', 'lr', 'nf'],
};

// The two embargo boundary cases restate the locked / open tables on purpose: the rule under
// test is "open at exactly 00:00 UTC of the date, locked one millisecond before".
export const EXPECTED: Readonly<Record<StateCase, Record<Action, Row>>> = {
  draft: DRAFT,
  in_review: IN_REVIEW,
  published: PUBLISHED_OPEN,
  'published, embargoed (date ahead)': PUBLISHED_LOCKED,
  'published, embargo 1 ms before 00:00 UTC': PUBLISHED_LOCKED,
  'published, embargo exactly 00:00 UTC': PUBLISHED_OPEN,
  withdrawn: WITHDRAWN,
};

// Renders the whole permission matrix as markdown for DEVELOPERS.md, by asking decide() itself.
import { ACTION_DESCRIPTIONS } from './actions';
import { decide } from './decide';
import { PHASES, type Phase } from './permissions';
import { ACTIONS, type Actor, type Resource } from './types';

// Fixed instants so the document is the same on every build.
const NOW = new Date(Date.UTC(2030, 0, 1));
const LATER = new Date(Date.UTC(2030, 6, 1));
const VERSION = 'matrix-version';

const COLUMNS: ReadonlyArray<readonly [string, Actor]> = [
  ['anonymous', { kind: 'anonymous' }],
  ['signed-in, no role', { kind: 'user', userId: 'u', siteRole: 'user' }],
  ['member', { kind: 'user', userId: 'u', siteRole: 'user', groupRole: 'member' }],
  ['curator', { kind: 'user', userId: 'u', siteRole: 'user', groupRole: 'curator' }],
  ['owner', { kind: 'user', userId: 'u', siteRole: 'user', groupRole: 'owner' }],
  ['site admin', { kind: 'user', userId: 'u', siteRole: 'admin' }],
  ['reviewer link', { kind: 'reviewer', link: { versionId: VERSION, expiresAt: LATER, revokedAt: null, anonymous: true } }],
];

const PHASE_TITLES: Readonly<Record<Phase, string>> = {
  draft: 'draft',
  in_review: 'in review',
  published: 'published',
  embargoed: 'published, files embargoed',
  withdrawn: 'withdrawn',
};

function resourceFor(phase: Phase): Resource {
  if (phase === 'embargoed') return { versionId: VERSION, state: 'published', embargoUntil: LATER, isLatest: true };
  return { versionId: VERSION, state: phase, embargoUntil: null, isLatest: true };
}

export function renderAccessMatrix(): string {
  const header = `| state | action | ${COLUMNS.map(([title]) => title).join(' | ')} |`;
  const rule = `| --- | --- | ${COLUMNS.map(() => ':---:').join(' | ')} |`;
  const rows = PHASES.flatMap((phase) =>
    ACTIONS.map((action) => {
      const cells = COLUMNS.map(([, actor]) => {
        const d = decide(actor, action, resourceFor(phase), NOW);
        return d.allowed ? '✓' : `\`${d.code}\``;
      });
      return `| ${PHASE_TITLES[phase]} | \`${action}\` | ${cells.join(' | ')} |`;
    }),
  );
  const actions = ACTIONS.map((action) => `- \`${action}\`: ${ACTION_DESCRIPTIONS[action]}`);
  const notes = [
    '- ✓ = allowed; otherwise the refusal code. A signed-in actor gets the union of its rows (e.g. a site admin who is also a member).',
    '- A reviewer link for another version is `not_found`; a revoked one `link_revoked`; an expired one (now ≥ expiry) `link_expired` — for every action.',
    '- Hidden versions answer `not_found` for every action, with one fixed reason, so nothing confirms they exist.',
    '- Embargo ends at 00:00 UTC on its date, decided at access time. Curves are derived from the files, so they are locked with them.',
    '- Withdrawn versions keep only their tombstone (metadata); files and curves are gone from view for everyone except the site admin (support).',
    '- Members create and revoke reviewer links; the access log is for curators, owners and the site admin.',
    '- Only owners (and the site admin) change members and roles; curators may invite new members.',
    '- `create_version` is refused with `wrong_state` when the resource is not the latest version (`isLatest: false`).',
  ];
  return [header, rule, ...rows, '', '**Actions**', '', ...actions, '', '**Notes**', '', ...notes, ''].join('\n');
}

export const ACCESS_MATRIX_DOC: string = renderAccessMatrix();

// Reads the table in permissions.ts; the only logic here is which refusal to report.
import { ACTION_LABELS } from './actions';
import { formatEmbargoDate, isEmbargoed } from './embargo';
import { AccessDeniedError } from './errors';
import { ACTION_REQUIREMENTS, PERMISSIONS, PHASES, type Phase, type Principal } from './permissions';
import { ACTIONS, type Action, type Actor, type Decision, type Denial, type DenialCode, type Resource, type VersionState } from './types';

const ALLOW: Decision = { allowed: true };

/** One text for every not_found, whatever the cause, so a refusal never confirms a hidden version exists. */
export const NOT_FOUND_REASON = 'We could not find this dataset version, or you do not have access to it.';

const STATE_WORDS: Readonly<Record<VersionState, string>> = {
  draft: 'a draft',
  in_review: 'in review',
  published: 'published',
  withdrawn: 'withdrawn',
};

function deny(code: DenialCode, reason: string): Denial {
  return { allowed: false, code, reason };
}

/** The table column that applies to this resource at `now`. */
export function phaseOf(resource: Resource, now: Date = new Date()): Phase {
  if (resource.state === 'published' && isEmbargoed(resource, now)) return 'embargoed';
  return resource.state;
}

/** Table rows the actor holds; a signed-in actor may hold several and gets their union. */
export function principalsOf(actor: Actor): Principal[] {
  if (actor.kind === 'anonymous') return ['anonymous'];
  if (actor.kind === 'reviewer') return ['reviewer'];
  const rows: Principal[] = ['user'];
  if (actor.groupRole) rows.push(actor.groupRole);
  if (actor.siteRole === 'admin') rows.push('admin');
  return rows;
}

function grants(principals: readonly Principal[], phase: Phase, action: Action): boolean {
  const who = PERMISSIONS[phase][action];
  return principals.some((p) => who.includes(p));
}

/** A link works only for its own version, until revoked or expired (valid while now < expiresAt). */
function linkRefusal(actor: Actor, resource: Resource, now: Date): Denial | null {
  if (actor.kind !== 'reviewer') return null;
  const { link } = actor;
  if (link.versionId !== resource.versionId) return deny('not_found', NOT_FOUND_REASON);
  if (link.revokedAt !== null) {
    return deny('link_revoked', 'This review link has been revoked. Ask the authors for a new link.');
  }
  if (now.getTime() >= link.expiresAt.getTime()) {
    return deny('link_expired', 'This review link has expired. Ask the authors for a new link.');
  }
  return null;
}

function unmetRequirement(action: Action, resource: Resource): Denial | null {
  if (ACTION_REQUIREMENTS[action] === 'latest_version' && resource.isLatest === false) {
    return deny('wrong_state', 'A new version can only be started from the latest version of the dataset.');
  }
  return null;
}

/**
 * Decide whether `actor` may do `action` on `resource` at `now`.
 * Refusal order: link problems, hidden (not_found), embargo, wrong state, not signed in, forbidden.
 */
export function decide(actor: Actor, action: Action, resource: Resource, now: Date = new Date()): Decision {
  const linkDenial = linkRefusal(actor, resource, now);
  if (linkDenial) return linkDenial;

  const principals = principalsOf(actor);
  const phase = phaseOf(resource, now);
  const label = ACTION_LABELS[action];

  if (grants(principals, phase, action)) return unmetRequirement(action, resource) ?? ALLOW;
  if (!grants(principals, phase, 'view_metadata')) return deny('not_found', NOT_FOUND_REASON);
  if (phase === 'embargoed' && grants(principals, 'published', action)) {
    const what = action === 'view_curves' ? 'The curves and files' : 'The files';
    return deny('embargoed', `${what} of this version are under embargo until ${formatEmbargoDate(resource)} at 00:00 UTC.`);
  }
  if (PHASES.some((other) => other !== phase && grants(principals, other, action))) {
    return deny('wrong_state', `You cannot ${label} while this version is ${STATE_WORDS[resource.state]}.`);
  }
  if (actor.kind === 'anonymous') return deny('not_signed_in', `Sign in to ${label}.`);
  return deny('forbidden', `Your role does not allow you to ${label}.`);
}

export function can(actor: Actor, action: Action, resource: Resource, now: Date = new Date()): boolean {
  return decide(actor, action, resource, now).allowed;
}

/** Throws AccessDeniedError (with code and 401/403/404 status) unless allowed. */
export function assertAllowed(actor: Actor, action: Action, resource: Resource, now: Date = new Date()): void {
  const decision = decide(actor, action, resource, now);
  if (!decision.allowed) throw new AccessDeniedError(decision);
}

/** Every action the actor may take now, e.g. for the UI to hide the controls it knows are refused. */
export function allowedActions(actor: Actor, resource: Resource, now: Date = new Date()): Action[] {
  return ACTIONS.filter((action) => can(actor, action, resource, now));
}

import 'server-only';
import { recordAudit } from '@/lib/audit/record-audit';
import { isValidOrcid } from '@/lib/schema/orcid';
import { findUserByEmail, findUserById } from './repo';
import { findUserByOrcid, findUserIdByOrcidAccount, insertUserWithOrcid, linkOrcidToUser } from './repo-orcid';

/** What the identity provider vouched for (id_token claims). */
export type OrcidClaims = {
  sub: string;
  name?: string | null;
  givenName?: string | null;
  familyName?: string | null;
  email?: string | null;
  emailVerified?: boolean;
};

export type OrcidSignInOutcome = 'known' | 'linked_by_orcid' | 'linked_by_email' | 'created';
export type OrcidSignInResult = { userId: string; orcid: string; outcome: OrcidSignInOutcome };

export type OrcidRefusal = 'invalid_orcid' | 'account_disabled' | 'email_unconfirmed' | 'orcid_conflict';
export class OrcidSignInError extends Error {
  constructor(readonly refusal: OrcidRefusal, message: string) {
    super(message);
    this.name = 'OrcidSignInError';
  }
}

/** The bare iD (0000-0000-0000-0000) from a `sub` that may come in the https://orcid.org/ form. */
export function canonicalOrcid(sub: string): string {
  return sub.trim().replace(/^https?:\/\/(sandbox\.)?orcid\.org\//i, '').toUpperCase();
}

/** Accounts made by ORCID sign-in without an e-mail the provider confirmed get an address that can never receive mail (RFC 2606 .invalid). */
export function placeholderEmail(orcid: string): string {
  return `orcid-${orcid.toLowerCase()}@users.ohmstead.invalid`;
}

function displayName(c: OrcidClaims): string {
  const joined = [c.givenName, c.familyName].filter((p) => p && p.trim()).join(' ').trim();
  return (c.name?.trim() || joined || c.sub).slice(0, 200);
}

async function usable(userId: string): Promise<void> {
  const user = await findUserById(userId);
  if (!user || user.disabled_at) throw new OrcidSignInError('account_disabled', 'This Ohmstead account is disabled.');
}

/**
 * Decides which Ohmstead user an ORCID sign-in is: the one already linked to the iD; else the one whose users.orcid
 * is the iD; else the one whose e-mail both the provider and Ohmstead have confirmed; else a new user. An e-mail
 * match is never enough on one side's word alone (that would let an unconfirmed sign-up take over the account).
 */
export async function linkOrcidSignIn(claims: OrcidClaims, opts: { ip?: string | null } = {}): Promise<OrcidSignInResult> {
  const orcid = canonicalOrcid(claims.sub);
  if (!isValidOrcid(orcid)) throw new OrcidSignInError('invalid_orcid', `The identity provider sent "${claims.sub}", which is not an ORCID iD.`);

  const known = await findUserIdByOrcidAccount(orcid);
  if (known) {
    await usable(known);
    await linkOrcidToUser(known, orcid); // fills users.orcid if an older link left it empty
    return { userId: known, orcid, outcome: 'known' };
  }

  const byOrcid = await findUserByOrcid(orcid);
  if (byOrcid) return link(byOrcid.id, orcid, 'linked_by_orcid', opts.ip);

  const email = claims.email?.trim().toLowerCase() || null;
  const providerConfirmed = Boolean(email && claims.emailVerified);
  const byEmail = email ? await findUserByEmail(email) : undefined;
  if (byEmail && providerConfirmed) {
    if (!byEmail.email_verified_at) {
      throw new OrcidSignInError('email_unconfirmed',
        'An Ohmstead account uses this e-mail address but has not confirmed it. Sign in to it with an e-mail link first, then sign in with ORCID to link the two.');
    }
    if (byEmail.orcid && byEmail.orcid !== orcid) {
      throw new OrcidSignInError('orcid_conflict', 'The Ohmstead account with this e-mail address is linked to another ORCID iD.');
    }
    return link(byEmail.id, orcid, 'linked_by_email', opts.ip);
  }

  // A new user; the provider's e-mail is used only when confirmed and not already someone else's.
  const ownEmail = providerConfirmed && !byEmail ? email! : placeholderEmail(orcid);
  const userId = await insertUserWithOrcid({ email: ownEmail, name: displayName(claims), orcid, emailVerifiedAt: ownEmail === email ? new Date() : null });
  await recordAudit({ action: 'user.sign_up', actorKind: 'user', actorUserId: userId, targetType: 'user', targetId: userId, ip: opts.ip, details: { method: 'orcid', orcid } });
  return { userId, orcid, outcome: 'created' };
}

async function link(userId: string, orcid: string, outcome: OrcidSignInOutcome, ip?: string | null): Promise<OrcidSignInResult> {
  await usable(userId);
  await linkOrcidToUser(userId, orcid);
  await recordAudit({ action: 'user.orcid_linked', actorKind: 'user', actorUserId: userId, targetType: 'user', targetId: userId, ip, details: { orcid, matchedBy: outcome === 'linked_by_email' ? 'email' : 'orcid' } });
  return { userId, orcid, outcome };
}

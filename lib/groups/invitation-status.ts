// Where an invitation stands at `now`: answered, expired (valid while now < expiresAt) or open.

export type InvitationStatus = 'pending' | 'expired' | 'accepted' | 'declined';

export function invitationStatus(inv: { accepted_at: Date | null; declined_at: Date | null; expires_at: Date }, now: Date = new Date()): InvitationStatus {
  if (inv.accepted_at) return 'accepted';
  if (inv.declined_at) return 'declined';
  return now.getTime() < new Date(inv.expires_at).getTime() ? 'pending' : 'expired';
}

/** "2 Dec 2026" in UTC, for messages about an expiry. */
export function utcDay(at: Date): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', day: 'numeric', month: 'short', year: 'numeric' }).format(at);
}

export const INVALID_INVITATION =
  'This invitation link is not valid. It may have been replaced by a newer invitation or withdrawn; ask the group to invite you again.';

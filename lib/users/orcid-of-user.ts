import 'server-only';
import { findOrcidOfUser } from './repo-orcid';

/** The user's ORCID iD (bare form, e.g. 0000-0000-0000-0108), linked by signing in with ORCID; null when none. */
export async function orcidOfUser(userId: string): Promise<string | null> {
  return findOrcidOfUser(userId);
}

// Invented researchers offered by the local ORCID sign-in fake. Their iDs sit in the 0000-0000 block, which ORCID
// does not issue, so they can never be someone's real record; the check digits are valid (lib/schema/orcid.ts).
import { orcidCheckDigit } from '@/lib/schema/orcid';

export type Researcher = {
  orcid: string;
  givenName: string;
  familyName: string;
  affiliation: string;
  /** The e-mail the provider would release, and whether it says the researcher confirmed it. */
  email: string | null;
  emailVerified: boolean;
};

/** The ORCID iD of the 15-digit base `0000-0000-0000-NNN`, with its ISO 7064 MOD 11-2 check character. */
export function testOrcid(serial: number): string {
  const base = `000000000000${String(serial).padStart(3, '0')}`;
  const full = base + orcidCheckDigit(base);
  return full.match(/.{4}/g)!.join('-');
}

// Two match demo accounts by confirmed e-mail (db/seeds/demo-accounts.json), so signing in links the iD to them;
// the others become new accounts: one with no released e-mail, one whose e-mail the provider has not confirmed.
export const RESEARCHERS: Researcher[] = [
  { orcid: testOrcid(101), givenName: 'Ada', familyName: 'Penhallow', affiliation: 'Larkspur Cryogenic Lab', email: 'ada.penhallow@larkspur.example', emailVerified: true },
  { orcid: testOrcid(102), givenName: 'Kit', familyName: 'Falconridge', affiliation: 'Cobalt Ridge Magnetotransport Lab', email: 'kit.falconridge@cobaltridge.example', emailVerified: true },
  { orcid: testOrcid(103), givenName: 'Wynn', familyName: 'Harrowgate', affiliation: 'Tidewater Thin Films Group', email: null, emailVerified: false },
  { orcid: testOrcid(104), givenName: 'Tamsin', familyName: 'Orrery', affiliation: 'Larkspur Cryogenic Lab', email: 'tamsin.orrery@larkspur.example', emailVerified: false },
];

export function researcherByOrcid(orcid: string): Researcher | undefined {
  return RESEARCHERS.find((r) => r.orcid === orcid);
}

import demo from '../demo-accounts.json';
import type { Creator } from '../../../lib/schema/transport-dataset.types';
import type { DemoDeposit } from './types';

// Creators are the invented demo accounts (db/seeds/demo-accounts.json) with their invented lab as affiliation.
// No ORCID iD or ROR ID: a made-up identifier with a valid check digit could belong to a real person or institution.

export const LAB_NAME: Record<DemoDeposit['groupSlug'], string> = {
  'larkspur-cryogenic': 'Larkspur Cryogenic Lab',
  'tidewater-thin-films': 'Tidewater Thin Films Group',
  'cobalt-ridge-magnetotransport': 'Cobalt Ridge Magnetotransport Lab',
};

export const CONSORTIUM = 'Meridian Transport Consortium';

/** A creator entry for a demo account, affiliated with its group's lab. */
export function creator(email: string): Creator {
  const account = demo.accounts.find((a) => a.email === email);
  if (!account?.group) throw new Error(`no demo account in a group with e-mail ${email}`);
  return { name: account.name, affiliation: [{ name: LAB_NAME[account.group as DemoDeposit['groupSlug']] }] };
}

/** The invented consortium's shared funding line. */
export const CONSORTIUM_FUNDING = [{ funderName: `${CONSORTIUM} (invented)`, awardNumber: 'MTC-2031-07', awardTitle: 'Shared transport reference data' }];

/** The line every demo description ends with. */
export const INVENTED_NOTE = `Invented demo data of the fictional ${CONSORTIUM}; not a real measurement.`;

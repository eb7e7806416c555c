// Anonymous review copies: creators, their affiliations and the depositing group are left out of every tag file.
import type { DataCiteAttributes } from '@/lib/datacite';
import type { TransportDataset } from '@/lib/schema';

/** DataCite's standard value for "value unavailable, possibly unknown" (DataCite Metadata Schema, appendix 3). */
export const DATACITE_UNAVAILABLE = '(:unav)';

/** The one name citations show in an anonymous copy (BibTeX {{Anonymous}}, "Anonymous (2026): …"). */
export const ANONYMOUS_AUTHOR = 'Anonymous';

/** The record without creators: used where a citation needs a name (CSL, BibTeX), with one placeholder author. */
export function recordForCitation(record: TransportDataset, anonymous: boolean): TransportDataset {
  return anonymous ? { ...record, creators: [{ name: ANONYMOUS_AUTHOR }] } : record;
}

/** DataCite attributes with one "(:unav)" creator and no contributors (the group is the only contributor). */
export function anonymiseDataCite(attributes: DataCiteAttributes): DataCiteAttributes {
  return {
    ...attributes,
    creators: [{ name: DATACITE_UNAVAILABLE, nameIdentifiers: [], affiliation: [] }],
    contributors: [],
  };
}

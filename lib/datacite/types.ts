import type { TransportDataset } from '@/lib/schema';

/** DataCite Metadata Schema 4.7 namespace (also the REST API's `schemaVersion`). */
export const DATACITE_NAMESPACE = 'http://datacite.org/schema/kernel-4';
export const DATACITE_SCHEMA_LOCATION = 'https://schema.datacite.org/meta/kernel-4.7/metadata.xsd';

/** One published file as the metadata describes it (the bytes live in object storage). */
export type PublishedFile = {
  name: string;
  sizeBytes: number;
  /** Media type, e.g. "text/csv". */
  format: string;
  sha256?: string;
  /** Where the file is fetched (access is still decided at download time). */
  downloadUrl?: string;
};

export type OrganisationRef = { name: string; rorId?: string };

/** Everything the record builders need about one published version (or the dataset's all-versions record). */
export type DataCiteInput = {
  /** The DOI this record registers: the version DOI, or the concept DOI when kind is 'concept'. */
  doi: string;
  kind: 'version' | 'concept';
  /** The dataset's all-versions DOI. */
  conceptDoi: string;
  /** This version's number; for a concept record, the latest version's. */
  versionNumber: number;
  previousVersionDoi?: string;
  nextVersionDoi?: string;
  /** Concept records only: every published version DOI, oldest first (each becomes HasVersion). */
  versionDois?: string[];
  record: TransportDataset;
  /** The hub, e.g. { name: 'Ohmstead' }. */
  publisher: OrganisationRef;
  /** The depositing group; a contributor of type ResearchGroup. */
  group: OrganisationRef;
  publicationYear: number;
  /** ISO 8601 instant of publication (dateType Issued). */
  publishedAt: string | Date;
  /** Files are restricted until this day (YYYY-MM-DD or instant; dateType Available). */
  embargoUntil?: string | Date | null;
  /** Set once the version is withdrawn (dateType Withdrawn, reason as dateInformation). */
  withdrawn?: { at: string | Date; reason?: string } | null;
  files: PublishedFile[];
  landingUrl: string;
  /** IETF language tag of title and description, when known. */
  language?: string;
};

export type DataCiteNameIdentifier = { nameIdentifier: string; nameIdentifierScheme: string; schemeUri?: string };
export type DataCiteAffiliation = {
  name: string;
  affiliationIdentifier?: string;
  affiliationIdentifierScheme?: string;
  schemeUri?: string;
};
export type DataCiteCreator = {
  name: string;
  nameType?: 'Personal' | 'Organizational';
  givenName?: string;
  familyName?: string;
  nameIdentifiers: DataCiteNameIdentifier[];
  affiliation: DataCiteAffiliation[];
};
export type DataCiteContributor = DataCiteCreator & { contributorType: string };
export type DataCiteRelatedIdentifier = {
  relatedIdentifier: string;
  relatedIdentifierType: string;
  relationType: string;
  resourceTypeGeneral?: string;
};
export type DataCiteFundingReference = {
  funderName: string;
  funderIdentifier?: string;
  funderIdentifierType?: string;
  schemeUri?: string;
  awardNumber?: string;
  awardTitle?: string;
};

/** The `attributes` of a DataCite REST API `dois` resource (JSON:API), as Ohmstead sends it. */
export type DataCiteAttributes = {
  doi: string;
  url: string;
  types: { resourceTypeGeneral: 'Dataset'; resourceType: string; schemaOrg: 'Dataset'; citeproc: 'dataset'; bibtex: 'misc'; ris: 'DATA' };
  creators: DataCiteCreator[];
  titles: { title: string; titleType?: string; lang?: string }[];
  publisher: { name: string; publisherIdentifier?: string; publisherIdentifierScheme?: string; schemeUri?: string };
  publicationYear: number;
  subjects: { subject: string; subjectScheme?: string; schemeUri?: string; valueUri?: string }[];
  contributors: DataCiteContributor[];
  dates: { date: string; dateType: string; dateInformation?: string }[];
  language?: string;
  relatedIdentifiers: DataCiteRelatedIdentifier[];
  sizes: string[];
  formats: string[];
  version?: string;
  rightsList: { rights: string; rightsUri?: string; rightsIdentifier?: string; rightsIdentifierScheme?: string; schemeUri?: string }[];
  descriptions: { description: string; descriptionType: string; lang?: string }[];
  fundingReferences: DataCiteFundingReference[];
  schemaVersion: typeof DATACITE_NAMESPACE;
};

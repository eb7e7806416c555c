import { create } from 'xmlbuilder2';
import { buildDataCiteJson } from './build-datacite-json';
import {
  DATACITE_NAMESPACE,
  DATACITE_SCHEMA_LOCATION,
  type DataCiteAttributes,
  type DataCiteContributor,
  type DataCiteCreator,
  type DataCiteInput,
} from './types';

const XSI_NAMESPACE = 'http://www.w3.org/2001/XMLSchema-instance';
const XML_NAMESPACE = 'http://www.w3.org/XML/1998/namespace';

type XMLBuilder = ReturnType<typeof create>;
type Attrs = Record<string, string | undefined>;

/** Adds a child with text and only the attributes that are set; `lang` becomes xml:lang. */
function add(parent: XMLBuilder, name: string, text: string | undefined, attrs: Attrs = {}, lang?: string): XMLBuilder {
  const defined = Object.fromEntries(Object.entries(attrs).filter((entry): entry is [string, string] => entry[1] !== undefined));
  const node = parent.ele(name, defined);
  if (lang) node.att(XML_NAMESPACE, 'xml:lang', lang);
  if (text !== undefined) node.txt(text);
  return node;
}

/** A wrapper element (`creators`, `dates`, …) only when it has children. */
function list<T>(parent: XMLBuilder, name: string, items: T[], each: (wrapper: XMLBuilder, item: T) => void): void {
  if (items.length === 0) return;
  const wrapper = parent.ele(name);
  for (const item of items) each(wrapper, item);
}

// Creator and contributor share one sequence: name, givenName, familyName, nameIdentifier*, affiliation* (4.7 XSD).
function person(parent: XMLBuilder, element: 'creator' | 'contributor', p: DataCiteCreator | DataCiteContributor): void {
  const node = add(parent, element, undefined, { contributorType: 'contributorType' in p ? p.contributorType : undefined });
  add(node, `${element}Name`, p.name, { nameType: p.nameType });
  if (p.givenName) add(node, 'givenName', p.givenName);
  if (p.familyName) add(node, 'familyName', p.familyName);
  for (const id of p.nameIdentifiers)
    add(node, 'nameIdentifier', id.nameIdentifier, { nameIdentifierScheme: id.nameIdentifierScheme, schemeURI: id.schemeUri });
  for (const a of p.affiliation)
    add(node, 'affiliation', a.name, {
      affiliationIdentifier: a.affiliationIdentifier,
      affiliationIdentifierScheme: a.affiliationIdentifierScheme,
      schemeURI: a.schemeUri,
    });
}

/** DataCite Metadata Schema 4.7 XML for REST API attributes (the JSON and the XML never disagree). */
export function renderDataCiteXml(a: DataCiteAttributes): string {
  // XML 1.0 cannot carry control characters; drop them rather than emit an unparsable record.
  const doc = create({ version: '1.0', encoding: 'UTF-8', invalidCharReplacement: '' });
  const root = doc
    .ele(DATACITE_NAMESPACE, 'resource')
    .att('http://www.w3.org/2000/xmlns/', 'xmlns:xsi', XSI_NAMESPACE)
    .att(XSI_NAMESPACE, 'xsi:schemaLocation', `${DATACITE_NAMESPACE} ${DATACITE_SCHEMA_LOCATION}`);

  add(root, 'identifier', a.doi, { identifierType: 'DOI' });
  list(root, 'creators', a.creators, (w, c) => person(w, 'creator', c));
  list(root, 'titles', a.titles, (w, t) => add(w, 'title', t.title, { titleType: t.titleType }, t.lang));
  const { name, publisherIdentifier, publisherIdentifierScheme, schemeUri } = a.publisher;
  add(root, 'publisher', name, { publisherIdentifier, publisherIdentifierScheme, schemeURI: schemeUri });
  add(root, 'publicationYear', String(a.publicationYear));
  add(root, 'resourceType', a.types.resourceType, { resourceTypeGeneral: a.types.resourceTypeGeneral });
  list(root, 'subjects', a.subjects, (w, s) =>
    add(w, 'subject', s.subject, { subjectScheme: s.subjectScheme, schemeURI: s.schemeUri, valueURI: s.valueUri }),
  );
  list(root, 'contributors', a.contributors, (w, c) => person(w, 'contributor', c));
  list(root, 'dates', a.dates, (w, d) => add(w, 'date', d.date, { dateType: d.dateType, dateInformation: d.dateInformation }));
  if (a.language) add(root, 'language', a.language);
  list(root, 'relatedIdentifiers', a.relatedIdentifiers, (w, r) =>
    add(w, 'relatedIdentifier', r.relatedIdentifier, {
      relatedIdentifierType: r.relatedIdentifierType,
      relationType: r.relationType,
      resourceTypeGeneral: r.resourceTypeGeneral,
    }),
  );
  list(root, 'sizes', a.sizes, (w, s) => add(w, 'size', s));
  list(root, 'formats', a.formats, (w, f) => add(w, 'format', f));
  if (a.version !== undefined) add(root, 'version', a.version);
  list(root, 'rightsList', a.rightsList, (w, r) =>
    add(w, 'rights', r.rights, {
      rightsURI: r.rightsUri,
      rightsIdentifier: r.rightsIdentifier,
      rightsIdentifierScheme: r.rightsIdentifierScheme,
      schemeURI: r.schemeUri,
    }),
  );
  list(root, 'descriptions', a.descriptions, (w, d) => add(w, 'description', d.description, { descriptionType: d.descriptionType }, d.lang));
  list(root, 'fundingReferences', a.fundingReferences, (w, f) => {
    const node = w.ele('fundingReference');
    add(node, 'funderName', f.funderName);
    if (f.funderIdentifier)
      add(node, 'funderIdentifier', f.funderIdentifier, { funderIdentifierType: f.funderIdentifierType ?? 'Other', schemeURI: f.schemeUri });
    if (f.awardNumber) add(node, 'awardNumber', f.awardNumber);
    if (f.awardTitle) add(node, 'awardTitle', f.awardTitle);
  });
  return doc.end({ prettyPrint: true });
}

/** DataCite 4.7 XML for one version or for the all-versions (concept) DOI. */
export function buildDataCiteXml(input: DataCiteInput): string {
  return renderDataCiteXml(buildDataCiteJson(input));
}

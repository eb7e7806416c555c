// Identifier forms shared by the DataCite, citation and JSON-LD builders.

const DOI_PREFIXES = /^(?:https?:\/\/(?:dx\.)?doi\.org\/|doi:)/i;

/** A DOI without resolver or `doi:` prefix, e.g. "10.99999/ohm.x7k2-p9q4". */
export function bareDoi(doi: string): string {
  return doi.trim().replace(DOI_PREFIXES, '');
}

/** The resolver URL of a DOI; characters a URL cannot carry are percent-encoded (DOI Handbook §2.5.2.4). */
export function doiUrl(doi: string): string {
  return 'https://doi.org/' + encodeURI(bareDoi(doi)).replace(/[#?]/g, (c) => '%' + c.charCodeAt(0).toString(16).toUpperCase());
}

/** An ORCID iD in its URL form ("https://orcid.org/0000-0002-1825-0097"), as ORCID asks it to be displayed. */
export function orcidUrl(orcid: string): string {
  const digits = orcid.trim().replace(/^https?:\/\/orcid\.org\//i, '').toUpperCase();
  return `https://orcid.org/${digits}`;
}

/** Day part (UTC) of an instant or a YYYY-MM-DD string; throws on anything else. */
export function isoDay(value: string | Date): string {
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value)) {
    // V8 rolls 2026-02-30 over to March; a real day survives the round trip unchanged.
    const parsed = new Date(`${value}T00:00:00Z`);
    if (Number.isNaN(parsed.getTime()) || parsed.toISOString().slice(0, 10) !== value) throw new RangeError(`Not a calendar day: ${value}`);
    return value;
  }
  const date = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(date.getTime())) throw new RangeError(`Not a date: ${String(value)}`);
  return date.toISOString().slice(0, 10);
}

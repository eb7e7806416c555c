import { parse } from '@citation-js/name';

/** A personal name split for citations; particles ("van der") stay with the family name so no format drops them. */
export type PersonName = { given?: string; family: string };

/** Splits "Imogen Vale", "Vale, Imogen" or "Jan van der Berg" into given and family parts (citation-js name parser). */
export function splitPersonName(name: string): PersonName {
  const text = name.trim().replace(/\s+/g, ' ');
  const parsed = parse(text);
  const family = [parsed['dropping-particle'], parsed['non-dropping-particle'], parsed.family, parsed.suffix]
    .filter((part): part is string => Boolean(part))
    .join(' ');
  if (!family) return { family: text };
  return parsed.given ? { given: parsed.given, family } : { family };
}

/** "Family, Given" (the order DataCite asks for in creatorName), or the family name alone. */
export function invertedName(name: PersonName): string {
  return name.given ? `${name.family}, ${name.given}` : name.family;
}

import { invertedName } from './person-name';
import { buildCslItem, type CitationInput } from './build-csl-item';

/**
 * DataCite's recommended citation: "Creator (PublicationYear): Title. Version. Publisher. (resourceTypeGeneral).
 * Identifier" (DataCite Metadata Schema 4.7, "Citation"); creators as "Family, Given", separated by semicolons.
 */
export function formatCitationText(input: CitationInput): string {
  const item = buildCslItem(input);
  const creators = item.author.map(invertedName).join('; ');
  const title = /[.?!]$/.test(item.title) ? item.title : `${item.title}.`;
  const version = item.version ? ` Version ${item.version}.` : '';
  return `${creators} (${item.issued['date-parts'][0][0]}): ${title}${version} ${item.publisher}. (Dataset). ${item.URL}`;
}

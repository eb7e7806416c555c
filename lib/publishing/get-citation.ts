import 'server-only';
import { CITATION_FORMATS, formatCitation, isCitationFormat } from '@/lib/citation';
import { requireVersionAction } from '@/lib/datasets/version-access';
import { AppError } from '@/lib/errors';
import { loadVersionDataCiteInput } from './datacite-input';

export type CitationDocument = { contentType: string; body: string };

/** How to cite a version: DataCite-style text, BibTeX, RIS or CSL-JSON (through lib/citation), for its viewers. */
export async function getCitation(input: { user: { id: string; siteRole: 'admin' | 'user' } | null; versionId: string; format: string | null }): Promise<CitationDocument> {
  const format = input.format ?? 'text';
  if (!isCitationFormat(format)) {
    const message = `Ask for format=${Object.keys(CITATION_FORMATS).join(', format=')} (got ${JSON.stringify(format)}).`;
    throw new AppError('validation_failed', message, { fieldErrors: { format: message } });
  }
  const { version } = await requireVersionAction(input.versionId, input.user, 'view_metadata');
  const record = await loadVersionDataCiteInput(version.id);
  return { contentType: CITATION_FORMATS[format].mediaType, body: formatCitation(record, format) };
}

import 'server-only';
import { buildDataCiteJson, buildDataCiteXml } from '@/lib/datacite';
import { requireVersionAction } from '@/lib/datasets/version-access';
import { AppError } from '@/lib/errors';
import { loadVersionDataCiteInput } from './datacite-input';

export const DATACITE_FORMATS = ['json', 'xml'] as const;
export type DataCiteFormat = (typeof DATACITE_FORMATS)[number];

export type DataCiteDocument = { contentType: string; body: string };

/**
 * A version's DataCite 4.7 record for whoever may view the version: XML, or JSON as the agency's JSON:API
 * resource. Unpublished versions get a preview (published "today", the requested embargo); meta.preview says so.
 */
export async function getDataCiteRecord(input: { user: { id: string; siteRole: 'admin' | 'user' } | null; versionId: string; format: string | null }): Promise<DataCiteDocument> {
  const format = input.format ?? 'json';
  if (!(DATACITE_FORMATS as readonly string[]).includes(format)) {
    const message = `Ask for format=json or format=xml (got ${JSON.stringify(format)}).`;
    throw new AppError('validation_failed', message, { fieldErrors: { format: message } });
  }
  const { version } = await requireVersionAction(input.versionId, input.user, 'view_metadata');
  const record = await loadVersionDataCiteInput(version.id);
  if (format === 'xml') return { contentType: 'application/xml; charset=utf-8', body: buildDataCiteXml(record) };
  const preview = version.state === 'draft' || version.state === 'in_review';
  const doc = { data: { id: record.doi, type: 'dois', attributes: buildDataCiteJson(record) }, meta: { preview } };
  return { contentType: 'application/vnd.api+json', body: JSON.stringify(doc) };
}

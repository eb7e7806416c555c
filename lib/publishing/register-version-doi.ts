import 'server-only';
import { buildDataCiteJson, buildDataCiteXml, type DataCiteInput } from '@/lib/datacite';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log';
import type { DoiRegistrar } from './doi-registrar';
import { conceptInput, conceptSourceVersion, registeredVersions, versionInput } from './datacite-input';
import { queuePublishedNotice } from './published-notice';
import {
  datasetIdOfVersion, listPublishedFiles, loadDatasetRegistrationRows, setDoiState, type DatasetRegistrationRows,
  type RegistrationVersionRow,
} from './repo';

export const DOI_REGISTER_TOPIC = 'doi.register';

/** REST attributes plus the same record as DataCite XML (base64), as the agency's API accepts both. */
export function registrationAttributes(input: DataCiteInput): Record<string, unknown> {
  return { ...buildDataCiteJson(input), xml: Buffer.from(buildDataCiteXml(input), 'utf8').toString('base64') };
}

/** Brings one version's DOI in line with its state: published → findable; withdrawn → registered (resolves, hidden). */
async function syncVersionDoi(rows: DatasetRegistrationRows, v: RegistrationVersionRow, registrar: DoiRegistrar): Promise<void> {
  const attributes = registrationAttributes(versionInput(rows, v, await listPublishedFiles(v.id)));
  if (v.state === 'published') {
    await registrar.put(v.doi!, attributes, 'publish');
    await setDoiState(v.id, 'published', 'findable');
    return;
  }
  // The agency only hides a findable DOI and only registers a draft one (or one it does not know yet).
  const remote = await registrar.state(v.doi!);
  await registrar.put(v.doi!, attributes, remote === 'findable' ? 'hide' : remote === 'registered' ? undefined : 'register');
  await setDoiState(v.id, 'withdrawn', 'registered');
}

/**
 * The 'doi.register' job: registers (or updates) the version DOI with its full record, refreshes the previous
 * version's record (IsPreviousVersionOf) and the all-versions DOI (HasVersion), then queues the "DOI registered"
 * mail once. Every call is a PUT of a known DOI, so replays update and never create a second DOI.
 */
export async function registerVersionDoi(versionId: string, registrar: DoiRegistrar): Promise<'registered' | 'skipped'> {
  const datasetId = await datasetIdOfVersion(versionId);
  const rows = datasetId ? await loadDatasetRegistrationRows(datasetId) : undefined;
  const version = rows?.versions.find((v) => v.id === versionId);
  if (!rows || !version || !registeredVersions(rows).some((v) => v.id === versionId)) return 'skipped';

  await syncVersionDoi(rows, version, registrar);

  const previous = registeredVersions(rows).filter((v) => v.version_number < version.version_number).at(-1);
  if (previous) {
    try {
      await syncVersionDoi(rows, previous, registrar);
    } catch (error) {
      // An older version with a record the schema no longer accepts must not block this one; agency errors retry.
      if (!(error instanceof AppError)) throw error;
      log('warn', 'could not refresh the previous version DOI', { versionId: previous.id, error: error.message });
    }
  }

  const source = conceptSourceVersion(rows);
  const concept = conceptInput(rows, source ? await listPublishedFiles(source.id) : []);
  if (concept) await registrar.put(concept.doi, registrationAttributes(concept), 'publish');

  if (version.state === 'published') await queuePublishedNotice(rows, version);
  return 'registered';
}

/** Outbox handler for 'doi.register' (payload { versionId }). */
export async function handleDoiRegister(payload: unknown, registrar: DoiRegistrar): Promise<void> {
  const versionId = (payload as { versionId?: unknown } | null)?.versionId;
  if (typeof versionId !== 'string') throw new Error(`doi.register payload has no versionId: ${JSON.stringify(payload)}`);
  await registerVersionDoi(versionId, registrar);
}

import 'server-only';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { markDoiReserved } from '@/lib/datasets/repo';
import { doiClient, type DoiClient } from './client';

export type ReserveOutcome = 'reserved' | 'already_reserved' | 'version_gone';

/**
 * Reserves a version's DOI and its dataset's all-versions DOI as drafts at the registration agency, then marks the
 * version 'reserved'. Safe to repeat: DOIs that already exist at the agency count as reserved.
 */
export async function reserveDraftDois(versionId: string, client: DoiClient = doiClient()): Promise<ReserveOutcome> {
  const version = await findVersionRow(versionId);
  if (!version) return 'version_gone'; // the draft was deleted before its DOIs were reserved
  if (version.doi_state !== 'none' || !version.doi) return 'already_reserved';
  // A draft carries only what we know now; the full DataCite record is sent at publication.
  const draftAttributes = { titles: [{ title: version.title }], types: { resourceTypeGeneral: 'Dataset' } };
  if (version.concept_doi) await client.createDraft(version.concept_doi, draftAttributes);
  await client.createDraft(version.doi, draftAttributes);
  await markDoiReserved(versionId);
  return 'reserved';
}

/** The outbox handler for topic 'doi.reserve' (payload { versionId }). */
export async function handleDoiReserve(payload: unknown, client?: DoiClient): Promise<void> {
  const versionId = (payload as { versionId?: unknown } | null)?.versionId;
  if (typeof versionId !== 'string') throw new Error(`doi.reserve payload has no versionId: ${JSON.stringify(payload)}`);
  await reserveDraftDois(versionId, client);
}

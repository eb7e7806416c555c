import 'server-only';
import { formatCitation } from '@/lib/citation';
import { mailJobs } from '@/lib/notify/mail-jobs';
import { publishedMail } from '@/lib/notify/publishing-mails';
import { listAuthorRecipients } from '@/lib/notify/repo';
import { versionInput } from './datacite-input';
import { claimPublishedNotice, listPublishedFiles, type DatasetRegistrationRows, type RegistrationVersionRow } from './repo';
import { versionLandingUrl } from './urls';

/**
 * Queues the "DOI registered" mail (with the DataCite-style citation) to the authors, once per version: the
 * conditional UPDATE on published_notice_sent_at lets only one of several replays queue it. True when queued.
 */
export async function queuePublishedNotice(rows: DatasetRegistrationRows, v: RegistrationVersionRow): Promise<boolean> {
  const input = versionInput(rows, v, await listPublishedFiles(v.id));
  const content = publishedMail({
    title: input.record.title, versionNumber: v.version_number, groupName: rows.group.name, doi: v.doi!,
    citation: formatCitation(input, 'text'), embargoUntil: v.embargo_until, landingUrl: versionLandingUrl(v.id),
  });
  const jobs = mailJobs(await listAuthorRecipients(v.id), content, { aggregateId: v.id, kind: 'version.published' });
  return claimPublishedNotice(v.id, jobs);
}

// Publishing notifications through the outbox and the SMTP fake: recipients, both parts, escaping, once-only mails.
// Expected recipients: issue 5 "Notifications" (submitted → curators and owners; approved, returned, published and
// embargo ended → the authors, i.e. whoever created the version and the dataset).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatCitation } from '@/lib/citation';
import { loadVersionDataCiteInput } from '@/lib/publishing/datacite-input';
import { doiRegistrar } from '@/lib/publishing/doi-registrar';
import { noteEmbargoEndIfDue, sweepEndedEmbargoes } from '@/lib/publishing/notify-embargo-end';
import { publishingOutboxHandlers } from '@/lib/publishing/outbox-handlers';
import { publishVersion } from '@/lib/publishing/publish-version';
import { registerVersionDoi } from '@/lib/publishing/register-version-doi';
import { returnToDraft } from '@/lib/publishing/return-to-draft';
import { submitVersion } from '@/lib/publishing/submit-version';
import { withdrawVersion } from '@/lib/publishing/withdraw-version';
import { createNewVersion } from '@/lib/publishing/create-new-version';
import { readMailbox, waitForMail, type StoredMail } from '@/tests/support/mailbox';
import { closeDb, closedPortUrl, drainJobs, inDays, jobsOf, makeDraft, makePubLab, removePubLab, type PubLab } from './fixtures';

let lab: PubLab;
const real = publishingOutboxHandlers();
const XSS_TITLE = 'R(T) <img src=x onerror="alert(1)"> & friends';

beforeAll(async () => {
  lab = await makePubLab();
});
afterAll(async () => {
  await removePubLab(lab);
  await closeDb();
});

async function mailsTo(email: string, since: Date, subject?: string): Promise<StoredMail[]> {
  return (await readMailbox()).filter((m) => m.to.includes(email) && new Date(m.date) >= since && (subject === undefined || m.subject === subject));
}

describe('submitted, returned, approved and published mails', () => {
  it('tells the curators and owners about a submission, with the title escaped in the HTML part', async () => {
    const since = new Date();
    const d = await makeDraft(lab, lab.member, XSS_TITLE);
    expect((await submitVersion({ user: lab.member, versionId: d.versionId }, { handlers: real })).notified).toBe(2);
    const subject = `Ready for review: ${XSS_TITLE} (v1)`;
    for (const steward of [lab.curator, lab.owner]) {
      const mail = await waitForMail({ to: steward.email, subject, since });
      expect(mail.text).toContain(`${lab.member.name} submitted "${XSS_TITLE}" (version 1) in ${lab.name} for review.`);
      expect(mail.html).toContain('R(T) &lt;img src=x onerror=&quot;alert(1)&quot;&gt; &amp; friends');
      expect(mail.html).not.toContain('<img');
      expect(mail.links).toContain(`${process.env.NEXTAUTH_URL}/deposit/${d.versionId}`);
    }
    for (const other of [lab.member, lab.outsider, lab.admin]) expect(await mailsTo(other.email, since, subject)).toEqual([]);
  });

  it('returns to the author with the comment quoted in both parts', async () => {
    const since = new Date();
    const d = await makeDraft(lab, lab.member, 'Returned for the sweep rate');
    await submitVersion({ user: lab.member, versionId: d.versionId }, { handlers: real });
    await returnToDraft({ user: lab.curator, versionId: d.versionId, comment: 'Add the sweep rate.\nAnd <script>x()</script>.' }, { handlers: real });
    const mail = await waitForMail({ to: lab.member.email, subject: 'Returned to draft: Returned for the sweep rate (v1)', since });
    expect(mail.text).toContain('> Add the sweep rate.\n> And <script>x()</script>.');
    expect(mail.html).toContain('Add the sweep rate.<br>And &lt;script&gt;x()&lt;/script&gt;.');
    expect(await mailsTo(lab.curator.email, since, 'Returned to draft: Returned for the sweep rate (v1)')).toEqual([]);
  });

  it('tells both authors of v2 about approval, then once, with DOI and citation, when the DOI is registered', async () => {
    const d = await makeDraft(lab, lab.member, 'Two authors: Hall bar at 14 T');
    await publishVersion({ user: lab.owner, versionId: d.versionId }, { handlers: real });
    const since = new Date();
    const v2 = await createNewVersion({ user: lab.curator, versionId: d.versionId });
    await publishVersion({ user: lab.owner, versionId: v2.versionId }, { handlers: real });
    for (const author of [lab.member, lab.curator]) {
      const approved = await waitForMail({ to: author.email, subject: 'Approved and published: Two authors: Hall bar at 14 T (v2)', since });
      expect(approved.text).toContain(`${lab.owner.name} approved "Two authors: Hall bar at 14 T" (version 2).`);
      expect(approved.text).toContain(`DOI: ${v2.doi}`);
    }
    expect(await mailsTo(lab.outsider.email, since)).toEqual([]);

    await drainJobs(v2.versionId, real);
    await registerVersionDoi(v2.versionId, doiRegistrar()); // a replay must not queue the mail again
    await drainJobs(v2.versionId, real);
    const citation = formatCitation(await loadVersionDataCiteInput(v2.versionId), 'text');
    const subject = 'DOI registered: Two authors: Hall bar at 14 T (v2)';
    for (const author of [lab.member, lab.curator]) {
      const mail = await waitForMail({ to: author.email, subject, since });
      expect(mail.text).toContain(citation);
      expect(mail.text).toContain(`DOI: https://doi.org/${v2.doi}`);
      expect(mail.links).toContain(`https://doi.org/${v2.doi}`);
      expect(await mailsTo(author.email, since, subject)).toHaveLength(1);
    }
  });

  it('only delays mail while the SMTP relay is down', async () => {
    const since = new Date();
    const d = await makeDraft(lab, lab.member, 'Mail relay down');
    const down = publishingOutboxHandlers({ mail: { smtpUrl: `smtp://127.0.0.1:${new URL(await closedPortUrl()).port}`, timeoutMs: 2000 } });
    await submitVersion({ user: lab.member, versionId: d.versionId }, { handlers: down });
    const jobs = await jobsOf(d.versionId, 'mail.send');
    expect(jobs.map((j) => [j.attempts, j.processed_at])).toEqual([[1, null], [1, null]]);
    expect(jobs[0]!.last_error).toMatch(/ECONNREFUSED/);
    expect(await mailsTo(lab.curator.email, since)).toEqual([]);
    await drainJobs(d.versionId, real);
    await waitForMail({ to: lab.curator.email, subject: 'Ready for review: Mail relay down (v1)', since });
    await waitForMail({ to: lab.owner.email, subject: 'Ready for review: Mail relay down (v1)', since });
  });
});

describe('embargo ended', () => {
  it('is queued exactly once however many views and sweeps race, and only from the embargo day on', async () => {
    const embargo = inDays(1);
    const d = await makeDraft(lab, lab.member, 'Embargo ends tomorrow');
    await publishVersion({ user: lab.curator, versionId: d.versionId, embargoUntil: embargo }, { handlers: real });
    expect(await noteEmbargoEndIfDue(d.versionId)).toBe(false); // still embargoed today

    const since = new Date();
    const dayOfRelease = new Date(`${embargo}T00:00:00Z`); // files open at 00:00 UTC on the embargo day
    const tries = await Promise.all([
      noteEmbargoEndIfDue(d.versionId, dayOfRelease), noteEmbargoEndIfDue(d.versionId, dayOfRelease), noteEmbargoEndIfDue(d.versionId, dayOfRelease),
      sweepEndedEmbargoes(dayOfRelease).then((s) => s.queued > 0),
    ]);
    expect(tries.filter(Boolean)).toHaveLength(1);
    expect(await noteEmbargoEndIfDue(d.versionId, new Date(`${inDays(3)}T12:00:00Z`))).toBe(false);
    const queued = (await jobsOf(d.versionId, 'mail.send')).filter((j) => (j.payload as { kind: string }).kind === 'version.embargo_ended');
    expect(queued.map((j) => (j.payload as { to: string }).to)).toEqual([lab.member.email]);

    await drainJobs(d.versionId, real);
    const mail = await waitForMail({ to: lab.member.email, subject: 'Files now open: Embargo ends tomorrow (v1)', since });
    expect(mail.text).toContain(`The embargo on "Embargo ends tomorrow" (version 1) ended on ${embargo} at 00:00 UTC.`);
    expect(mail.html).toContain('Embargo ends tomorrow');
    expect(await mailsTo(lab.member.email, since, 'Files now open: Embargo ends tomorrow (v1)')).toHaveLength(1);
  });

  it('is not sent for a withdrawn version', async () => {
    const d = await makeDraft(lab, lab.member, 'Withdrawn under embargo');
    const embargo = inDays(2);
    await publishVersion({ user: lab.curator, versionId: d.versionId, embargoUntil: embargo }, { handlers: real });
    await withdrawVersion({ user: lab.curator, versionId: d.versionId, reason: 'Wrong sample label' }, { handlers: real });
    expect(await noteEmbargoEndIfDue(d.versionId, new Date(`${embargo}T00:00:00Z`))).toBe(false);
  });
});

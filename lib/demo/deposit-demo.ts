import 'server-only';
import { createHash } from 'node:crypto';
import { runAnalysisOnce } from '@/lib/analysis/run-analysis';
import { createDataset } from '@/lib/datasets/create-dataset';
import { saveMetadata } from '@/lib/datasets/save-metadata';
import { publishVersion } from '@/lib/publishing/publish-version';
import { submitVersion } from '@/lib/publishing/submit-version';
import { withdrawVersion } from '@/lib/publishing/withdraw-version';
import { beginUpload } from '@/lib/uploads/begin-upload';
import { completeUpload } from '@/lib/uploads/complete-upload';
import type { SiteRole } from '@/lib/access';

// The demo goes through the same operations an author's browser and a curator use: create, upload parts to the
// presigned URLs, complete (server-side SHA-256 check), describe, analyse, submit, publish or withdraw.

export type DemoActor = { id: string; name: string; siteRole: SiteRole };
export type DemoOutcome = 'draft' | 'in_review' | 'published' | 'embargoed' | 'withdrawn';
export type DemoUpload = { name: string; role: 'raw' | 'processed' | 'other'; bytes: Uint8Array };
export type DemoPlan = {
  author: DemoActor;
  steward: DemoActor;
  groupSlug: string;
  title: string;
  record: unknown;
  files: DemoUpload[];
  outcome: DemoOutcome;
  /** YYYY-MM-DD for the embargoed outcome. */
  embargoUntil?: string;
};

async function uploadFile(author: DemoActor, versionId: string, file: DemoUpload): Promise<string> {
  const sha256 = createHash('sha256').update(file.bytes).digest('hex');
  const begun = await beginUpload({ user: author, versionId, input: { name: file.name, sizeBytes: file.bytes.byteLength, sha256, role: file.role } });
  const parts = [];
  for (const part of begun.parts) {
    const start = (part.partNumber - 1) * begun.partSizeBytes;
    const body = file.bytes.subarray(start, Math.min(start + begun.partSizeBytes, file.bytes.byteLength));
    const res = await fetch(part.url, { method: 'PUT', body: Buffer.from(body) });
    if (!res.ok) throw new Error(`demo upload of ${file.name} part ${part.partNumber}: storage answered ${res.status}`);
    parts.push({ partNumber: part.partNumber, etag: res.headers.get('etag') ?? '' });
  }
  const done = await completeUpload({ user: author, fileId: begun.fileId, input: { parts } });
  return done.file.id;
}

/** Runs the analysis of these files here, so the demo is complete when the seed ends (the worker would too). */
async function analyse(fileIds: string[]): Promise<void> {
  for (let i = 0; i < fileIds.length * 3; i++) {
    if ((await runAnalysisOnce({ fileIds })) === null) return;
  }
}

export async function depositDemo(plan: DemoPlan): Promise<{ versionId: string; datasetId: string }> {
  const created = await createDataset({ user: plan.author, groupSlug: plan.groupSlug, title: plan.title });
  const fileIds = [];
  for (const file of plan.files) fileIds.push(await uploadFile(plan.author, created.versionId, file));
  const saved = await saveMetadata({ user: plan.author, versionId: created.versionId, record: plan.record });
  if (!saved.complete) {
    throw new Error(`demo record "${plan.title}" is incomplete: ${saved.errors.map((e) => `${e.path}: ${e.message}`).join('; ')}`);
  }
  await analyse(fileIds);
  if (plan.outcome === 'draft') return created;
  await submitVersion({ user: plan.author, versionId: created.versionId, embargoUntil: plan.embargoUntil ?? null });
  if (plan.outcome === 'in_review') return created;
  await publishVersion({ user: plan.steward, versionId: created.versionId });
  if (plan.outcome === 'withdrawn') {
    await withdrawVersion({ user: plan.steward, versionId: created.versionId, reason: 'Superseded: the geometry factor was recorded for the wrong contact pair (demo scenario).' });
  }
  return created;
}

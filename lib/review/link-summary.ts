import { linkStatus, type LinkStatus } from './link-rules';

// What the authors see of a link: never its token (shown once at creation) and never who used it.

export type LinkSummary = {
  id: string;
  versionId: string;
  label: string;
  anonymous: boolean;
  status: LinkStatus;
  expiresAt: string;
  revokedAt: string | null;
  lastUsedAt: string | null;
  createdAt: string;
  createdBy: string | null;
  uses: { views: number; downloads: number };
};

type LinkFacts = {
  id: string; version_id: string; label: string; anonymous: boolean; expires_at: Date; revoked_at: Date | null;
  last_used_at: Date | null; created_at: Date; created_by_name?: string | null; views?: number; downloads?: number;
};

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function summariseLink(row: LinkFacts, now: Date): LinkSummary {
  return {
    id: row.id,
    versionId: row.version_id,
    label: row.label,
    anonymous: row.anonymous,
    status: linkStatus({ expiresAt: row.expires_at, revokedAt: row.revoked_at }, now),
    expiresAt: row.expires_at.toISOString(),
    revokedAt: iso(row.revoked_at),
    lastUsedAt: iso(row.last_used_at),
    createdAt: row.created_at.toISOString(),
    createdBy: row.created_by_name ?? null,
    uses: { views: row.views ?? 0, downloads: row.downloads ?? 0 },
  };
}

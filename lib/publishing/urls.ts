import 'server-only';
import { env } from '@/lib/env';

// Public addresses that DOIs and mails point at; the landing pages live at these paths.

function base(): string {
  return env().NEXTAUTH_URL.replace(/\/+$/, '');
}

/** Landing page of one version (what the version DOI resolves to). */
export function versionLandingUrl(versionId: string): string {
  return `${base()}/versions/${encodeURIComponent(versionId)}`;
}

/** Landing page of the dataset as a whole (what the all-versions DOI resolves to; shows the latest version). */
export function conceptLandingUrl(datasetId: string): string {
  return `${base()}/datasets/${encodeURIComponent(datasetId)}`;
}

/** The signed-in workspace where authors edit and curators review a version. */
export function workspaceUrl(versionId: string): string {
  return `${base()}/deposit/${encodeURIComponent(versionId)}`;
}

import type { MailBlock, MailContent } from './render-mail';

// The words of each publishing notification. Values are plain text; render-mail escapes them for HTML.

export type VersionFacts = { title: string; versionNumber: number; groupName: string };

const named = (v: VersionFacts) => `"${v.title}" (version ${v.versionNumber})`;
const doiUrlOf = (doi: string) => `https://doi.org/${doi}`;

function embargoLine(embargoUntil: string | null, verb: 'requested' | 'set'): MailBlock[] {
  if (!embargoUntil) return [];
  return [{ kind: 'p', text: `Embargo ${verb}: the files stay with the group until ${embargoUntil} (they open at 00:00 UTC that day); the landing page, metadata and DOI are public at once.` }];
}

/** To the group's curators and owners when a version is submitted. */
export function submittedMail(v: VersionFacts & { submitterName: string; requestedEmbargo: string | null; reviewUrl: string }): MailContent {
  return {
    subject: `Ready for review: ${v.title} (v${v.versionNumber})`,
    blocks: [
      { kind: 'p', text: `${v.submitterName} submitted ${named(v)} in ${v.groupName} for review.` },
      ...embargoLine(v.requestedEmbargo, 'requested'),
      { kind: 'p', text: 'As a curator or owner of the group you can publish it, or return it to draft with a comment for the authors.' },
      { kind: 'link', label: 'Open the version', url: v.reviewUrl },
    ],
  };
}

/** To the authors when a curator returns the version to draft. */
export function returnedMail(v: VersionFacts & { curatorName: string; comment: string; workspaceUrl: string }): MailContent {
  return {
    subject: `Returned to draft: ${v.title} (v${v.versionNumber})`,
    blocks: [
      { kind: 'p', text: `${v.curatorName} returned ${named(v)} to draft with this comment:` },
      { kind: 'quote', text: v.comment },
      { kind: 'p', text: 'You can edit the draft again and submit it when it is ready.' },
      { kind: 'link', label: 'Open the draft', url: v.workspaceUrl },
    ],
  };
}

/** To the authors when a curator approves (and so publishes) the version; the DOI may still be registering. */
export function approvedMail(v: VersionFacts & { curatorName: string; doi: string; embargoUntil: string | null; landingUrl: string }): MailContent {
  return {
    subject: `Approved and published: ${v.title} (v${v.versionNumber})`,
    blocks: [
      { kind: 'p', text: `${v.curatorName} approved ${named(v)}. It is published now and can no longer be changed; start a new version for corrections.` },
      ...embargoLine(v.embargoUntil, 'set'),
      { kind: 'facts', items: [['DOI', v.doi], ['DOI registration', 'in progress; a second message follows with the citation once it is registered']] },
      { kind: 'link', label: 'Open the landing page', url: v.landingUrl },
    ],
  };
}

/** To the authors once the version DOI is registered and findable. */
export function publishedMail(v: VersionFacts & { doi: string; citation: string; embargoUntil: string | null; landingUrl: string }): MailContent {
  return {
    subject: `DOI registered: ${v.title} (v${v.versionNumber})`,
    blocks: [
      { kind: 'p', text: `The DOI of ${named(v)} is registered and resolves to its landing page.` },
      { kind: 'facts', items: [['DOI', doiUrlOf(v.doi)], ['Group', v.groupName]] },
      ...embargoLine(v.embargoUntil, 'set'),
      { kind: 'p', text: 'Cite it as:' },
      { kind: 'citation', text: v.citation },
      { kind: 'link', label: 'Open the landing page', url: v.landingUrl },
    ],
  };
}

/** To the authors, once, when the files of an embargoed version open. */
export function embargoEndedMail(v: VersionFacts & { doi: string | null; embargoUntil: string; landingUrl: string }): MailContent {
  return {
    subject: `Files now open: ${v.title} (v${v.versionNumber})`,
    blocks: [
      { kind: 'p', text: `The embargo on ${named(v)} ended on ${v.embargoUntil} at 00:00 UTC. Anyone can now see its curves and download its files.` },
      ...(v.doi ? [{ kind: 'facts', items: [['DOI', doiUrlOf(v.doi)]] } satisfies MailBlock] : []),
      { kind: 'link', label: 'Open the landing page', url: v.landingUrl },
    ],
  };
}

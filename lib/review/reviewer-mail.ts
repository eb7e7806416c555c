import type { MailBlock, MailContent } from '@/lib/notify/render-mail';

// The words of the mail that carries a reviewer link. In anonymous mode it names neither authors nor group.

export type ReviewerMailFacts = {
  title: string;
  versionNumber: number;
  url: string;
  expiresAt: Date;
  /** Null in anonymous mode. */
  sender: { name: string; groupName: string } | null;
  message: string | null;
};

/** "2027-03-31 17:00 UTC" */
function utcMinute(at: Date): string {
  return `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function reviewerLinkMail(f: ReviewerMailFacts): MailContent {
  const opening = f.sender
    ? `${f.sender.name} (${f.sender.groupName}) has given you private access to a dataset on Ohmstead for review.`
    : 'The authors of a dataset on Ohmstead have given you private access to it for review.';
  const note: MailBlock[] = f.message ? [{ kind: 'p', text: 'Their note:' }, { kind: 'quote', text: f.message }] : [];
  return {
    subject: `Confidential review copy: ${f.title}`,
    blocks: [
      { kind: 'p', text: opening },
      ...note,
      { kind: 'facts', items: [['Dataset', `${f.title} (version ${f.versionNumber})`], ['Link valid until', utcMinute(f.expiresAt)]] },
      { kind: 'link', label: 'Open the review copy', url: f.url },
      {
        kind: 'p',
        text: 'No account is needed. The link is meant for you alone: anyone who has it can open the review copy until it expires, so please do not pass it on. The authors see when the link was used, never who used it.',
      },
    ],
  };
}

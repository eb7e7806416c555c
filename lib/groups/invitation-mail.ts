import type { GroupRole } from '@/lib/access';
import type { MailContent } from '@/lib/notify/render-mail';
import { ROLE_DUTIES, ROLE_WORDS } from './group-access';

// The words of the invitation mail. Values are plain text; lib/notify/render-mail escapes them for the HTML part.

export type InvitationMailFacts = {
  groupName: string;
  institution: string | null;
  inviterName: string;
  email: string;
  role: GroupRole;
  url: string;
  expiresAt: Date;
};

/** "2027-03-31 17:00 UTC" */
function utcMinute(at: Date): string {
  return `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function invitationMail(f: InvitationMailFacts): MailContent {
  const where = f.institution ? `${f.groupName} (${f.institution})` : f.groupName;
  return {
    subject: `Invitation to join ${f.groupName} on Ohmstead`,
    blocks: [
      { kind: 'p', text: `${f.inviterName} invites you to join ${where} on Ohmstead as ${ROLE_WORDS[f.role]}.` },
      { kind: 'p', text: `As ${ROLE_WORDS[f.role]} you ${ROLE_DUTIES[f.role]}.` },
      { kind: 'facts', items: [['Group', f.groupName], ['Role', f.role], ['Invited address', f.email], ['Valid until', utcMinute(f.expiresAt)]] },
      { kind: 'link', label: 'Accept or decline the invitation', url: f.url },
      {
        kind: 'p',
        text: `To accept, sign in with ${f.email} (a sign-in link by e-mail creates the account if you have none). If you did not expect this invitation, decline it or ignore this message; nothing happens without your answer.`,
      },
    ],
  };
}

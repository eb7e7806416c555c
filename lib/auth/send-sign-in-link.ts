import 'server-only';
import { sendMail } from '@/lib/mail/send-mail';

export async function sendSignInLink(email: string, url: string): Promise<void> {
  await sendMail({
    to: email,
    subject: 'Your Ohmstead sign-in link',
    text: [
      'Use this link to sign in to Ohmstead. It works once and expires in 15 minutes:',
      '',
      url,
      '',
      'If you did not ask for it, ignore this message; nobody can sign in without the link.',
    ].join('\n'),
  });
}

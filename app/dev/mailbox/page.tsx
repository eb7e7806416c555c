import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PageTitle } from '@/components/ui/page-title';
import { listMailbox, mailboxEnabled } from '@/lib/mail/mailbox';

export const metadata: Metadata = { title: 'Development mailbox', robots: { index: false } };
export const dynamic = 'force-dynamic';

// Exists only while the local SMTP fake is configured (MAIL_DIR set); a real relay leaves it unset.
export default async function MailboxPage() {
  if (!mailboxEnabled()) notFound();
  const messages = await listMailbox();
  return (
    <div>
      <PageTitle lead="Every message the local SMTP fake received, newest first. This page does not exist in production.">Development mailbox</PageTitle>
      {messages.length === 0 ? (
        <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-slate-600">No mail yet. Sign-in links and password resets appear here.</p>
      ) : (
        <ul className="flex flex-col gap-3">
          {messages.map((m) => (
            <li key={m.id} className="rounded-lg border border-slate-200 bg-white p-4">
              <p className="font-medium">{m.subject}</p>
              <p className="text-xs text-slate-500">to {m.to.join(', ')} · from {m.from} · <time dateTime={m.date}>{m.date}</time></p>
              <pre className="mt-2 whitespace-pre-wrap break-words font-mono text-sm text-slate-800">{m.text}</pre>
              {m.links.length > 0 && (
                <ul className="mt-2 text-sm">
                  {m.links.map((l) => <li key={l}><a href={l} className="break-all text-copper-700 underline">{l}</a></li>)}
                </ul>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

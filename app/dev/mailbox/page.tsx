import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { SiteHeader } from '@/components/site-header';
import { getEnv } from '@/lib/server/env';

export const metadata: Metadata = { title: 'Dev mailbox' };

interface CaughtMessage {
  id: string;
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
}

/** Messages held by the local mail catcher. Exists only while the catcher is configured — never in production. */
export default async function DevMailboxPage() {
  const url = getEnv().MAIL_CATCHER_URL;
  if (!url) notFound();
  const messages: CaughtMessage[] = await fetch(`${url}/messages`, { cache: 'no-store' })
    .then((r) => r.json())
    .catch(() => []);
  const linkify = (text: string) =>
    text.split(/(https?:\/\/\S+)/g).map((part, i) =>
      /^https?:\/\//.test(part) ? (
        <a key={i} href={part} className="break-all text-accent underline">
          {part}
        </a>
      ) : (
        part
      ),
    );
  return (
    <>
      <SiteHeader />
      <main id="main" className="mx-auto max-w-page px-6 py-10">
        <h1 className="text-2xl font-semibold">Dev mailbox</h1>
        <p className="mt-2 text-sm text-graphite-soft">Mail sent by this local server is caught here and never leaves the machine.</p>
        {messages.length === 0 ? <p className="mt-6 text-graphite-muted">No messages yet.</p> : null}
        <ol className="mt-6 space-y-6">
          {messages.map((m) => (
            <li key={m.id} className="border-t-[0.5px] border-rule pt-4" data-testid="mailbox-message">
              <p className="tabular text-xs text-graphite-muted">
                {m.receivedAt} → {m.to.join(', ')}
              </p>
              <h2 className="mt-1 font-medium">{m.subject}</h2>
              <p className="mt-2 whitespace-pre-wrap text-sm">{linkify(m.text)}</p>
            </li>
          ))}
        </ol>
      </main>
    </>
  );
}

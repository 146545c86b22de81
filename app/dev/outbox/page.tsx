import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { format } from 'date-fns';
import { getActor, can } from '@/lib/server/auth/actor';
import { serverEnv } from '@/lib/server/config/env';

export const metadata: Metadata = { title: 'Outbox (demo)' };
export const dynamic = 'force-dynamic';

type Message = { id: string; receivedAt: string; to: string[]; subject: string; text: string };

// Demo only: shows what the local mail fake received, so a person can follow e-mailed links. The
// messages hold everyone's sign-in and invitation links, so only the site administrator sees them.
export default async function OutboxPage() {
  const env = serverEnv();
  if (!env.BORELINE_DEV_TOOLS || env.BORELINE_MODE === 'serve') notFound();
  const actor = await getActor();
  if (!actor) redirect(`/sign-in?callbackUrl=${encodeURIComponent('/dev/outbox')}`);
  if (!can(actor, 'dev.outbox')) redirect('/not-allowed');
  const port = env.MAIL_FAKE_HTTP_PORT;
  let messages: Message[] = [];
  let error: string | undefined;
  try {
    const res = await fetch(`http://127.0.0.1:${port}/messages`, { cache: 'no-store' });
    messages = (await res.json()).data;
  } catch {
    error = 'The local mail fake is not running (the start command starts it).';
  }
  return (
    <main className="mx-auto max-w-3xl space-y-4 px-4 py-8">
      <h1>Outbox</h1>
      <p className="rounded-lg bg-doubt-100 p-3">
        Demo only, for the site administrator: every e-mail the app sent to the local mail fake, newest first.
      </p>
      {error && <p className="field-error">{error}</p>}
      {messages.length === 0 && !error && <p>No messages yet.</p>}
      <ul className="space-y-3">
        {messages.map((m) => (
          <li key={m.id} className="card space-y-2">
            <p className="text-sm text-ink-mute">
              {format(new Date(m.receivedAt), 'd MMM yyyy HH:mm:ss')} · to {m.to.join(', ')}
            </p>
            <h2 className="text-lg">{m.subject}</h2>
            <pre className="whitespace-pre-wrap break-words font-sans text-base">
              {m.text.split(/(https?:\/\/\S+)/g).map((part, i) =>
                /^https?:\/\//.test(part) ? (
                  <a key={i} href={part}>
                    {part}
                  </a>
                ) : (
                  part
                ),
              )}
            </pre>
          </li>
        ))}
      </ul>
    </main>
  );
}

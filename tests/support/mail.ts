import { MAIL_INBOX } from './env';

export type Mail = { id: string; to: string[]; subject: string; text: string; html: string };

/** Waits for the newest message to an address in the mail fake's inbox. */
export async function waitForMail(to: string, opts: { subject?: RegExp; timeoutMs?: number } = {}): Promise<Mail> {
  const deadline = Date.now() + (opts.timeoutMs ?? 10_000);
  while (Date.now() < deadline) {
    const res = await fetch(`${MAIL_INBOX}?to=${encodeURIComponent(to)}`);
    const { data } = (await res.json()) as { data: Mail[] };
    const hit = data.find((m) => !opts.subject || opts.subject.test(m.subject));
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no e-mail to ${to} within the time limit`);
}

export function firstLink(mail: Mail): string {
  const m = mail.text.match(/https?:\/\/\S+/);
  if (!m) throw new Error(`no link in e-mail "${mail.subject}"`);
  return m[0];
}

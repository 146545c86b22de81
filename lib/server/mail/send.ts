import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { serverEnv } from '@/lib/server/config/env';

const globalForMail = globalThis as unknown as { __borelineMail?: Transporter };

function transporter(): Transporter {
  if (!globalForMail.__borelineMail) {
    // Pooled (nodemailer reads its options from the URL's query): a few SMTP connections kept open
    // and reused, not a new handshake for every message. SMTP_URL may set its own pool options.
    const url = new URL(serverEnv().SMTP_URL);
    if (!url.searchParams.has('pool')) url.searchParams.set('pool', 'true');
    if (!url.searchParams.has('maxConnections')) url.searchParams.set('maxConnections', '3');
    globalForMail.__borelineMail = nodemailer.createTransport(url.toString());
  }
  return globalForMail.__borelineMail;
}

export type OutgoingMail = { to: string; subject: string; text: string; html?: string };

/** Sends one message through the configured SMTP relay (the local fake in development). */
export async function sendMail(mail: OutgoingMail) {
  await transporter().sendMail({
    from: serverEnv().MAIL_FROM,
    ...mail,
  });
}

export function escapeHtml(text: string) {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** A plain, readable message with one action link, in text and HTML. */
export function linkMail(opts: {
  to: string;
  subject: string;
  intro: string;
  linkLabel: string;
  url: string;
  outro?: string;
}): OutgoingMail {
  const text = `${opts.intro}\n\n${opts.linkLabel}: ${opts.url}\n\n${opts.outro ?? ''}`.trim();
  const html = `<p>${escapeHtml(opts.intro)}</p><p><a href="${escapeHtml(opts.url)}">${escapeHtml(opts.linkLabel)}</a></p>${
    opts.outro ? `<p>${escapeHtml(opts.outro)}</p>` : ''
  }`;
  return { to: opts.to, subject: opts.subject, text, html };
}

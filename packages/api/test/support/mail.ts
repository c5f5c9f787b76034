import type { Client } from './test-app.js';

export interface CapturedMail {
  id: string;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  attachments: { filename: string; contentType: string; size: number }[];
  links: string[];
  sentAt: string;
}

/** The dev outbox as the web would read it (newest first). */
export async function outbox(client: Client): Promise<CapturedMail[]> {
  const res = await client.get('/api/dev/outbox');
  if (res.status !== 200) throw new Error(`outbox: ${res.status} ${res.text}`);
  return (res.body as { items: CapturedMail[] }).items;
}

/** Waits for a mail to `to` whose subject matches (some mail is sent after the answer). */
export async function waitForMail(
  client: Client,
  to: string,
  subject: RegExp,
  timeoutMs = 5_000,
): Promise<CapturedMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = (await outbox(client)).find((m) => m.to === to && subject.test(m.subject));
    if (found) return found;
    if (Date.now() > until) throw new Error(`no mail to ${to} matching ${subject}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The path of the first link in a mail that contains `marker` (e.g. "/invitations/"). */
export function linkPath(mail: CapturedMail, marker: string): string {
  const link = mail.links.find((l) => l.includes(marker));
  if (!link) throw new Error(`no ${marker} link in "${mail.subject}"`);
  return new URL(link).pathname;
}

/** Opens the address-confirmation link mailed at sign-up, as its owner would. */
export async function confirmAddress(client: Client, email: string): Promise<void> {
  const mail = await waitForMail(client, email, /Confirm your e-mail/);
  const token = linkPath(mail, '/verify-email/').split('/').pop()!;
  const res = await client.post('/api/auth/email-verification/confirm', { token });
  if (res.status !== 200) throw new Error(`confirming ${email}: ${res.status} ${res.text}`);
}

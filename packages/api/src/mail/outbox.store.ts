import { randomBytes } from 'node:crypto';
import { mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { simpleParser } from 'mailparser';

export interface OutboxItem {
  id: string;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  attachments: { filename: string; contentType: string; size: number }[];
  links: string[];
  messageId: string;
  sentAt: string;
}

/** Mail the fake SMTP server caught: `<id>.json` (parsed) beside `<id>.eml` (as received). */
export class OutboxStore {
  constructor(readonly dir: string) {}

  async save(raw: Buffer, recipients: string[]): Promise<OutboxItem> {
    await mkdir(this.dir, { recursive: true, mode: 0o700 });
    const mail = await simpleParser(raw, { skipTextToHtml: true, skipTextLinks: true });
    const now = new Date();
    const id = `${now.getTime().toString().padStart(15, '0')}-${randomBytes(4).toString('hex')}`;
    const item: OutboxItem = {
      id,
      from: mail.from?.text ?? '',
      to: recipients.join(', '),
      subject: mail.subject ?? '',
      text: mail.text ?? '',
      html: mail.html || '',
      attachments: mail.attachments.map((a) => ({
        filename: a.filename ?? 'unnamed',
        contentType: a.contentType,
        size: a.size,
      })),
      links: linksIn(mail.text ?? ''),
      messageId: mail.messageId ?? '',
      sentAt: now.toISOString(),
    };
    await writeFile(path.join(this.dir, `${id}.eml`), raw, { mode: 0o600 });
    await writeFile(path.join(this.dir, `${id}.json`), JSON.stringify(item, null, 2), {
      mode: 0o600,
    });
    return item;
  }

  /** Newest first. */
  async list(): Promise<OutboxItem[]> {
    let names: string[];
    try {
      names = await readdir(this.dir);
    } catch {
      return [];
    }
    const files = names.filter((n) => n.endsWith('.json')).sort((a, b) => (a < b ? 1 : -1));
    return Promise.all(
      files.map(
        async (n) => JSON.parse(await readFile(path.join(this.dir, n), 'utf8')) as OutboxItem,
      ),
    );
  }
}

export function linksIn(text: string): string[] {
  return [...new Set(text.match(/https?:\/\/[^\s<>"')]+/g) ?? [])];
}

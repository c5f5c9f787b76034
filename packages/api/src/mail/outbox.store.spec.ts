import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import MailComposer from 'nodemailer/lib/mail-composer';
import { afterAll, describe, expect, it } from 'vitest';
import { OutboxStore } from './outbox.store.js';

// The reference is nodemailer's own MailComposer: whatever it writes, the outbox must read back.
const compose = (options: ConstructorParameters<typeof MailComposer>[0]) =>
  new MailComposer(options).compile().build();

const dir = mkdtempSync(path.join(tmpdir(), 'workback-outbox-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('OutboxStore.save (round trip through nodemailer’s MailComposer)', () => {
  it('reads subject, sender, both parts, links and attachments, and keeps the raw mail', async () => {
    const store = new OutboxStore(dir);
    const pdf = Buffer.alloc(70_000, 7);
    const link = `http://localhost:3000/invitations/${'A'.repeat(43)}`;
    const text = `Hello,\nthe link: ${link}\n` + 'long line '.repeat(30);
    const raw = await compose({
      from: 'Workback <no-reply@workback.test>',
      to: 'tutor@example.test',
      subject: 'Review list for Wren — 7 × 8 again',
      text,
      html: `<p>Hello, <a href="${link}">accept</a> — ümlaut</p>`,
      attachments: [
        { filename: 'review-plan.pdf', content: pdf, contentType: 'application/pdf' },
        {
          filename: 'übersicht mit einem sehr langen namen für die liste.csv',
          content: 'a,b\n1,2\n',
        },
      ],
    });
    const item = await store.save(raw, ['tutor@example.test']);
    expect(item.subject).toBe('Review list for Wren — 7 × 8 again');
    expect(item.to).toBe('tutor@example.test');
    expect(item.from).toContain('no-reply@workback.test');
    expect(item.text).toBe(text);
    expect(item.html).toBe(`<p>Hello, <a href="${link}">accept</a> — ümlaut</p>`);
    expect(item.links).toEqual([link]);
    expect(item.attachments).toEqual([
      { filename: 'review-plan.pdf', contentType: 'application/pdf', size: 70_000 },
      {
        filename: 'übersicht mit einem sehr langen namen für die liste.csv',
        contentType: 'text/csv',
        size: 8,
      },
    ]);
    expect(readFileSync(path.join(dir, `${item.id}.eml`))).toEqual(raw);
    expect((await store.list()).map((m) => m.id)).toContain(item.id);
  });

  it('reads a text-only message', async () => {
    const store = new OutboxStore(dir);
    const raw = await compose({ to: 'a@example.test', subject: 'Hi', text: 'plain' });
    const item = await store.save(raw, ['a@example.test']);
    expect(item).toMatchObject({ subject: 'Hi', html: '', attachments: [] });
    // mailparser keeps the line break that ends a single-part message.
    expect(item.text.trimEnd()).toBe('plain');
  });
});

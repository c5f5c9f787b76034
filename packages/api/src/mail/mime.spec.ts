import MailComposer from 'nodemailer/lib/mail-composer';
import { describe, expect, it } from 'vitest';
import { decodeWords, parseMail } from './mime.js';

// The reference is nodemailer's own MailComposer: whatever it writes, we must read back.
const compose = (options: ConstructorParameters<typeof MailComposer>[0]) =>
  new MailComposer(options).compile().build();

describe('parseMail (round trip through nodemailer’s MailComposer)', () => {
  it('reads subject, recipients, both parts and attachments', async () => {
    const pdf = Buffer.alloc(70_000, 7);
    const raw = await compose({
      from: 'Workback <no-reply@workback.test>',
      to: 'tutor@example.test',
      subject: 'Review list for Wren — 7 × 8 again',
      text: 'Hello,\nthe link: http://localhost:3000/invitations/abc\n' + 'long line '.repeat(30),
      html: '<p>Hello, <a href="http://localhost:3000/invitations/abc">accept</a> — ümlaut</p>',
      attachments: [
        { filename: 'review-plan.pdf', content: pdf, contentType: 'application/pdf' },
        {
          filename: 'übersicht mit einem sehr langen namen für die liste.csv',
          content: 'a,b\n1,2\n',
        },
      ],
    });
    const mail = parseMail(raw);
    expect(mail.subject).toBe('Review list for Wren — 7 × 8 again');
    expect(mail.to).toBe('tutor@example.test');
    expect(mail.from).toContain('no-reply@workback.test');
    expect(mail.text).toBe(
      'Hello,\nthe link: http://localhost:3000/invitations/abc\n' + 'long line '.repeat(30),
    );
    expect(mail.html).toBe(
      '<p>Hello, <a href="http://localhost:3000/invitations/abc">accept</a> — ümlaut</p>',
    );
    expect(mail.attachments).toEqual([
      { filename: 'review-plan.pdf', contentType: 'application/pdf', size: 70_000 },
      {
        filename: 'übersicht mit einem sehr langen namen für die liste.csv',
        contentType: 'text/csv',
        size: 8,
      },
    ]);
  });

  it('reads a text-only message', async () => {
    const mail = parseMail(await compose({ to: 'a@example.test', subject: 'Hi', text: 'plain' }));
    expect(mail).toMatchObject({ subject: 'Hi', text: 'plain', html: '', attachments: [] });
  });

  it('decodes Q and B encoded words (RFC 2047 examples)', () => {
    // RFC 2047 section 8 examples.
    expect(decodeWords('=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=')).toBe('ab');
    expect(decodeWords('=?UTF-8?B?w7xiZXI=?=')).toBe('über');
    expect(decodeWords('=?UTF-8?Q?a_b?=')).toBe('a b');
  });
});

import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailService } from '../src/mail/mail.service.js';
import { outbox } from './support/mail.js';
import { Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

describe('with the fake SMTP server (SMTP_URL unset)', () => {
  let t: TestApp;
  let owner: Client;

  beforeAll(async () => {
    t = await startTestApp({ SMTP_URL: '', SIGN_IN_LIMIT_PER_MINUTE: '100' });
    owner = await signedIn(t, DEMO.owner);
  });
  afterAll(() => t.close());

  it('really sends over SMTP and keeps what the server caught, with text, HTML and attachments', async () => {
    const mail = t.app.get(MailService);
    expect(mail.usesFakeServer).toBe(true);
    const pdf = Buffer.alloc(12_345, 1);
    await mail.send({
      to: 'someone@example.test',
      subject: 'A test letter — with “quotes” & <angles>',
      paragraphs: ['First line.', 'Second: http://localhost:3000/somewhere'],
      action: { label: 'Open it', url: 'http://localhost:3000/open?x=1&y=2' },
      sentBy: 'Robin, of a test household',
      reason: 'because a test asked',
      attachments: [{ filename: 'plan.pdf', content: pdf, contentType: 'application/pdf' }],
    });
    const [item] = await outbox(new Client(t.http()));
    expect(item).toMatchObject({
      to: 'someone@example.test',
      subject: 'A test letter — with “quotes” & <angles>',
      attachments: [{ filename: 'plan.pdf', size: 12_345 }],
      links: ['http://localhost:3000/somewhere', 'http://localhost:3000/open?x=1&y=2'],
    });
    expect(item!.from).toContain('no-reply@workback.test');
    expect(item!.text).toContain('Sent by Workback for Robin, of a test household');
    expect(item!.text).toContain('because a test asked');
    expect(item!.html).toContain('<a href="http://localhost:3000/open?x=1&amp;y=2">Open it</a>');
    expect(item!.html).toContain('Sent by Workback for Robin');
    expect(new Date(item!.sentAt).getTime()).toBeGreaterThan(Date.now() - 60_000);

    const files = readdirSync(path.join(t.dataDir, 'outbox'));
    expect(files.filter((f) => f.endsWith('.json'))).toHaveLength(1);
    const eml = files.find((f) => f.endsWith('.eml'))!;
    expect(readFileSync(path.join(t.dataDir, 'outbox', eml), 'latin1')).toMatch(
      /^Content-Type: multipart\/mixed/m,
    );
  });

  it('serves the outbox as a plain escaped page without scripts', async () => {
    const res = await new Client(t.http()).get('/dev/outbox').set('accept', 'text/html');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('A test letter — with “quotes” &amp; &lt;angles&gt;');
    expect(res.text).not.toContain('<angles>');
    expect(res.text).not.toMatch(/<script|<style|\sstyle="/i);
    expect(res.headers['content-security-policy']).toContain("script-src 'self'");
  });

  it('says who sent an invitation and why, in both parts', async () => {
    await owner
      .post('/api/invitations', { email: 'helper@example.test', role: 'parent' })
      .expect(201);
    const mail = (await outbox(owner)).find((m) => m.to === 'helper@example.test')!;
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('Robin');
      expect(part).toContain('The Hollow Lane household');
      expect(part).toMatch(/because Robin entered this address/);
    }
  });
});

describe('with a real relay at SMTP_URL', () => {
  let t: TestApp;
  let relay: SMTPServer;
  const received: { to: string[]; raw: string }[] = [];

  beforeAll(async () => {
    // Stands in for the family's mail provider: a separate SMTP server the app only knows by URL.
    relay = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      onData(stream, session, callback) {
        let raw = '';
        stream.on('data', (c: Buffer) => (raw += c.toString('latin1')));
        stream.on('end', () => {
          received.push({ to: session.envelope.rcptTo.map((r) => r.address), raw });
          callback();
        });
      },
    });
    await new Promise<void>((resolve) => relay.listen(0, '127.0.0.1', resolve));
    const { port } = relay.server.address() as AddressInfo;
    t = await startTestApp({
      SMTP_URL: `smtp://127.0.0.1:${port}`,
      SIGN_IN_LIMIT_PER_MINUTE: '100',
    });
  });
  afterAll(async () => {
    await t.close();
    await new Promise<void>((resolve) => relay.close(() => resolve()));
  });

  it('sends there, and the dev outbox does not exist', async () => {
    const owner = await signedIn(t, DEMO.owner);
    await owner.post('/api/invitations', { email: 'far@example.test', role: 'parent' }).expect(201);
    expect(received).toHaveLength(1);
    expect(received[0]!.to).toEqual(['far@example.test']);
    // Read the decoded text: quoted-printable may wrap a long line inside the link.
    const { text } = await simpleParser(received[0]!.raw);
    expect(text).toMatch(/\/invitations\/[A-Za-z0-9_-]{43}/);
    const anon = new Client(t.http());
    const json = await anon.get('/api/dev/outbox');
    expect(json.status).toBe(404);
    expect(json.body.message).toMatch(/SMTP_URL/);
    expect((await anon.get('/dev/outbox').set('accept', 'text/html')).status).toBe(404);
    expect(t.app.get(MailService).usesFakeServer).toBe(false);
  });
});

describe('shutdown', () => {
  it('stops the fake server with the app', async () => {
    const t = await startTestApp({ SMTP_URL: '' });
    const mail = t.app.get(MailService);
    const port = (
      mail as unknown as { fake: { server: { server: { address(): AddressInfo } } } }
    ).fake.server.server.address().port;
    await t.close();
    const net = await import('node:net');
    const refused = await new Promise<boolean>((resolve) => {
      const socket = net.connect(port, '127.0.0.1');
      socket.on('connect', () => {
        socket.destroy();
        resolve(false);
      });
      socket.on('error', () => resolve(true));
    });
    expect(refused).toBe(true);
  });
});

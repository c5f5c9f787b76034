import type { NestExpressApplication } from '@nestjs/platform-express';
import type { NextFunction, Request, Response } from 'express';
import { NO_OUTBOX } from './dev-outbox.controller.js';
import { escapeHtml as e } from './letter.js';
import { MailService } from './mail.service.js';
import type { OutboxItem } from './outbox.store.js';

/**
 * `GET /dev/outbox`: the caught mail as a plain server-rendered page (no
 * scripts, no inline styles: the CSP allows neither). Mounted outside /api
 * and before the web app's fallback, so the SPA does not swallow it.
 */
export function mountDevOutboxPage(app: NestExpressApplication): void {
  const mail = app.get(MailService);
  app.use('/dev/outbox', (req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' || (req.path !== '/' && req.path !== '')) return next();
    if (!mail.outbox) {
      res.status(404).json({ statusCode: 404, error: 'Not Found', message: NO_OUTBOX });
      return;
    }
    mail.outbox.list().then(
      (items) => {
        res.setHeader('Cache-Control', 'no-store');
        res.type('html').send(renderOutbox(items));
      },
      (err: unknown) => next(err),
    );
  });
}

export function renderOutbox(items: readonly OutboxItem[]): string {
  const body =
    items.length === 0
      ? '<p>No mail yet. Invite someone or ask for a password reset, then reload this page.</p>'
      : items.map(renderItem).join('\n');
  return `<!doctype html>
<html lang="en">
<head><meta charset="utf-8"><title>Workback dev outbox</title><link rel="icon" href="data:,"></head>
<body>
<h1>Dev outbox</h1>
<p>Mail caught by the fake SMTP server, newest first (${items.length}). Only shown while SMTP_URL is unset.</p>
${body}
</body>
</html>`;
}

function renderItem(item: OutboxItem): string {
  const links = item.links.map((l) => `<li><a href="${e(l)}">${e(l)}</a></li>`).join('');
  const attachments = item.attachments
    .map((a) => `<li>${e(a.filename)} (${e(a.contentType)}, ${a.size} bytes)</li>`)
    .join('');
  return `<article>
<h2>${e(item.subject)}</h2>
<p>To ${e(item.to)} · from ${e(item.from)} · <time datetime="${e(item.sentAt)}">${e(item.sentAt)}</time></p>
${links ? `<h3>Links</h3><ul>${links}</ul>` : ''}
${attachments ? `<h3>Attachments</h3><ul>${attachments}</ul>` : ''}
<pre>${e(item.text)}</pre>
<details><summary>HTML part (source)</summary><pre>${e(item.html)}</pre></details>
</article>
<hr>`;
}

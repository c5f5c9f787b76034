import type { MailAttachment, MailMessage } from './mailer.js';

/** One e-mail in Workback's plain house style: who sent it and why always close it. */
export interface Letter {
  to: string;
  subject: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  /** Who asked for this mail, e.g. "Robin, of The Hollow Lane household". */
  sentBy: string;
  /** Why the reader got it, e.g. "because Robin invited this address". */
  reason: string;
  attachments?: MailAttachment[];
}

export function composeLetter(letter: Letter): MailMessage {
  const footer = `Sent by Workback for ${letter.sentBy}. You got this e-mail ${letter.reason}.`;
  const text = [
    ...letter.paragraphs,
    ...(letter.action ? [`${letter.action.label}:\n${letter.action.url}`] : []),
    `-- \n${footer}`,
  ].join('\n\n');
  const html = [
    '<!doctype html>',
    '<html><body style="font-family: sans-serif; color: #1f2a44; line-height: 1.5">',
    ...letter.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    ...(letter.action
      ? [
          `<p><a href="${escapeHtml(letter.action.url)}">${escapeHtml(letter.action.label)}</a></p>`,
          `<p style="font-size: 0.9em">Or paste this address into your browser: ${escapeHtml(letter.action.url)}</p>`,
        ]
      : []),
    `<hr><p style="font-size: 0.85em; color: #4a5572">${escapeHtml(footer)}</p>`,
    '</body></html>',
  ].join('\n');
  return {
    to: letter.to,
    subject: letter.subject,
    text,
    html,
    ...(letter.attachments ? { attachments: letter.attachments } : {}),
  };
}

export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

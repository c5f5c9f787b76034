/**
 * Just enough MIME reading for the dev outbox: headers (folded, RFC 2047
 * encoded words), nested multiparts, base64 and quoted-printable bodies, and
 * attachment names (RFC 2231). mailparser is not installed; this reads what
 * nodemailer writes, which is all the fake server ever receives.
 */
export interface ParsedMail {
  subject: string;
  from: string;
  to: string;
  messageId: string;
  text: string;
  html: string;
  attachments: { filename: string; contentType: string; size: number }[];
}

type Headers = Map<string, string>;

export function parseMail(raw: Buffer): ParsedMail {
  const { headers, body } = splitPart(raw);
  const mail: ParsedMail = {
    subject: decodeWords(headers.get('subject') ?? ''),
    from: decodeWords(headers.get('from') ?? ''),
    to: decodeWords(headers.get('to') ?? ''),
    messageId: (headers.get('message-id') ?? '').trim(),
    text: '',
    html: '',
    attachments: [],
  };
  // The line break that ends the message is not part of a single-part body.
  const end =
    body.length >= 2 && body.subarray(-2).toString() === '\r\n' ? body.length - 2 : body.length;
  walk(headers, body.subarray(0, end), mail);
  return mail;
}

function walk(headers: Headers, body: Buffer, mail: ParsedMail): void {
  const type = parseParams(headers.get('content-type') ?? 'text/plain');
  const mediaType = type.value.toLowerCase();
  if (mediaType.startsWith('multipart/') && type.params.boundary) {
    for (const part of splitMultipart(body, type.params.boundary)) {
      const inner = splitPart(part);
      walk(inner.headers, inner.body, mail);
    }
    return;
  }
  const content = decodeBody(body, headers.get('content-transfer-encoding') ?? '7bit');
  const disposition = parseParams(headers.get('content-disposition') ?? 'inline');
  const filename = disposition.params.filename ?? type.params.name;
  const isAttachment = disposition.value.toLowerCase() === 'attachment' || filename !== undefined;
  if (!isAttachment && mediaType === 'text/plain' && !mail.text) {
    mail.text = content.toString('utf8');
  } else if (!isAttachment && mediaType === 'text/html' && !mail.html) {
    mail.html = content.toString('utf8');
  } else {
    mail.attachments.push({
      filename: decodeWords(filename ?? 'unnamed'),
      contentType: mediaType,
      size: content.length,
    });
  }
}

function splitPart(raw: Buffer): { headers: Headers; body: Buffer } {
  let end = raw.indexOf('\r\n\r\n');
  let gap = 4;
  if (end < 0) {
    end = raw.indexOf('\n\n');
    gap = 2;
  }
  if (end < 0) return { headers: parseHeaders(raw.toString('latin1')), body: Buffer.alloc(0) };
  return {
    headers: parseHeaders(raw.subarray(0, end).toString('latin1')),
    body: raw.subarray(end + gap),
  };
}

function parseHeaders(head: string): Headers {
  const headers: Headers = new Map();
  const unfolded = head.replace(/\r?\n[ \t]+/g, ' ');
  for (const line of unfolded.split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    // Header bytes are UTF-8 when not encoded-words; re-read them as such.
    const value = Buffer.from(line.slice(colon + 1).trim(), 'latin1').toString('utf8');
    if (!headers.has(name)) headers.set(name, value);
  }
  return headers;
}

function splitMultipart(body: Buffer, boundary: string): Buffer[] {
  const text = body.toString('latin1');
  const delimiter = `--${boundary}`;
  const parts: Buffer[] = [];
  let start = text.indexOf(delimiter);
  while (start >= 0) {
    const afterDelimiter = start + delimiter.length;
    if (text.startsWith('--', afterDelimiter)) break;
    const next = text.indexOf(`\n${delimiter}`, afterDelimiter);
    if (next < 0) break;
    const chunk = text
      .slice(afterDelimiter, next)
      .replace(/^[ \t]*\r?\n/, '')
      .replace(/\r$/, '');
    parts.push(Buffer.from(chunk, 'latin1'));
    start = next + 1;
  }
  return parts;
}

function decodeBody(body: Buffer, encoding: string): Buffer {
  switch (encoding.trim().toLowerCase()) {
    case 'base64':
      return Buffer.from(body.toString('latin1').replace(/[^A-Za-z0-9+/=]/g, ''), 'base64');
    case 'quoted-printable':
      return decodeQuotedPrintable(body.toString('latin1'));
    default:
      return body;
  }
}

function decodeQuotedPrintable(text: string, underscoreIsSpace = false): Buffer {
  const joined = text.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const ch = joined[i]!;
    const hex = joined.slice(i + 1, i + 3);
    if (ch === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else if (ch === '_' && underscoreIsSpace) {
      bytes.push(0x20);
    } else {
      bytes.push(joined.charCodeAt(i) & 0xff);
    }
  }
  return Buffer.from(bytes);
}

/** RFC 2047 `=?UTF-8?Q?...?=` / `=?UTF-8?B?...?=`; whitespace between two encoded words is dropped. */
export function decodeWords(value: string): string {
  return value
    .replace(/(\?=)\s+(=\?)/g, '$1$2')
    .replace(
      /=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g,
      (_m, _charset: string, kind: string, data: string) =>
        (kind.toUpperCase() === 'B'
          ? Buffer.from(data, 'base64')
          : decodeQuotedPrintable(data, true)
        ).toString('utf8'),
    );
}

/** `type/sub; a="b"; c*=utf-8''x%20y; d*0="p"; d*1="q"` → value and decoded params. */
function parseParams(header: string): { value: string; params: Record<string, string> } {
  const [value = '', ...rest] = splitOutsideQuotes(header);
  const pieces = new Map<string, { index: number; text: string; encoded: boolean }[]>();
  for (const item of rest) {
    const eq = item.indexOf('=');
    if (eq < 0) continue;
    const key = item.slice(0, eq).trim().toLowerCase();
    let text = item.slice(eq + 1).trim();
    if (text.startsWith('"') && text.endsWith('"'))
      text = text.slice(1, -1).replace(/\\(.)/g, '$1');
    const match = /^([^*]+)(?:\*(\d+))?(\*)?$/.exec(key);
    if (!match) continue;
    const name = match[1]!;
    const list = pieces.get(name) ?? [];
    list.push({ index: Number(match[2] ?? 0), text, encoded: match[3] === '*' });
    pieces.set(name, list);
  }
  const params: Record<string, string> = {};
  for (const [name, list] of pieces) {
    list.sort((a, b) => a.index - b.index);
    const bytes: Buffer[] = [];
    for (const [i, piece] of list.entries()) {
      let text = piece.text;
      if (piece.encoded) {
        if (i === 0) text = text.replace(/^[^']*'[^']*'/, '');
        bytes.push(Buffer.from(decodeURIComponentBytes(text)));
      } else {
        bytes.push(Buffer.from(text, 'utf8'));
      }
    }
    params[name] = Buffer.concat(bytes).toString('utf8');
  }
  return { value: value.trim(), params };
}

function decodeURIComponentBytes(text: string): Uint8Array {
  const out: number[] = [];
  for (let i = 0; i < text.length; i++) {
    const hex = text.slice(i + 1, i + 3);
    if (text[i] === '%' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      out.push(parseInt(hex, 16));
      i += 2;
    } else {
      out.push(...Buffer.from(text[i]!, 'utf8'));
    }
  }
  return Uint8Array.from(out);
}

function splitOutsideQuotes(header: string): string[] {
  const items: string[] = [];
  let current = '';
  let quoted = false;
  for (let i = 0; i < header.length; i++) {
    const ch = header[i]!;
    if (ch === '\\' && quoted) {
      current += ch + (header[i + 1] ?? '');
      i++;
      continue;
    }
    if (ch === '"') quoted = !quoted;
    if (ch === ';' && !quoted) {
      items.push(current);
      current = '';
    } else {
      current += ch;
    }
  }
  items.push(current);
  return items;
}

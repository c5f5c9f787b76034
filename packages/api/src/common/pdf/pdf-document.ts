import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import * as fontkit from 'fontkit';
import PDFDocument from 'pdfkit';
import { woffToSfnt } from './woff.js';

const require = createRequire(import.meta.url);

/**
 * The font files ship with @fontsource as WOFF and WOFF2 (latin subset: −, ×, ÷ included).
 * pdfkit's fontkit cannot subset these WOFF2 files, and reading Plex Mono's WOFF it fails
 * on the empty space glyph: every face is read from WOFF, and mono text is drawn run by
 * run on a fixed grid (`monoText`), never asking the font for a space.
 */
function fontFile(pkg: string, file: string): Buffer {
  const woff = readFileSync(
    path.join(path.dirname(require.resolve(`${pkg}/LICENSE`)), 'files', file),
  );
  // Unwrapped once per process, not inflated again by every document (see woff.ts).
  return woffToSfnt(woff);
}

/**
 * Each face is parsed once per process (fontkit), not again by every document: pdfkit takes a
 * parsed font as it takes a file, and each document still embeds its own subset of it.
 */
const FONTS = {
  sans: parsed('@fontsource/ibm-plex-sans', 'ibm-plex-sans-latin-400-normal.woff'),
  sansBold: parsed('@fontsource/ibm-plex-sans', 'ibm-plex-sans-latin-600-normal.woff'),
  sansItalic: parsed('@fontsource/ibm-plex-sans', 'ibm-plex-sans-latin-400-italic.woff'),
  mono: parsed('@fontsource/ibm-plex-mono', 'ibm-plex-mono-latin-400-normal.woff'),
  monoBold: parsed('@fontsource/ibm-plex-mono', 'ibm-plex-mono-latin-600-normal.woff'),
};
type Face = keyof typeof FONTS;

function parsed(pkg: string, file: string): fontkit.Font {
  return fontkit.create(fontFile(pkg, file)) as fontkit.Font;
}

/**
 * pdfkit shapes every word it measures or writes (fontkit's OpenType layout, most of a PDF's
 * time) and keeps the result per document and face (`layoutCache`, word → glyph run). The runs
 * depend only on the face and the word, so one table per face serves every document; it is
 * started afresh past LAYOUT_WORDS words (a few hundred bytes each), which bounds its memory.
 */
const LAYOUT_WORDS = 5_000;
const layouts = new Map<Face, { words: Record<string, unknown>; documents: number }>();

function sharedLayouts(face: Face): Record<string, unknown> {
  let table = layouts.get(face);
  // Counting its words now and then, not at every document.
  if (table && ++table.documents % 50 === 0 && Object.keys(table.words).length > LAYOUT_WORDS)
    table = undefined;
  if (!table) layouts.set(face, (table = { words: Object.create(null), documents: 0 }));
  return table.words;
}

export const INK = '#1f2a44';
export const PENCIL = '#5d6678';
export const HIGHLIGHT = '#fbe7b0';
export const RULE = '#c9cfdb';
export const MARGIN = 56;

export type Doc = PDFKit.PDFDocument;

/** An A4 document with IBM Plex embedded, pages buffered so footers can be added at the end. */
export function newDocument(title: string): Doc {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN + 20, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: { Title: title, Creator: 'Workback', Producer: 'Workback' },
  });
  for (const [face, font] of Object.entries(FONTS) as [Face, fontkit.Font][]) {
    // PDFFontSource does not list a parsed font, which pdfkit's font factory takes as it is.
    doc.registerFont(face, font as unknown as Buffer);
    const embedded = (doc.font(face) as unknown as { _font?: { layoutCache?: object } })._font;
    if (embedded?.layoutCache) embedded.layoutCache = sharedLayouts(face);
  }
  doc.font('sans').fontSize(10.5).fillColor(INK);
  return doc;
}

/** Writes the footer line and page numbers on every page, ends the document, and gives its bytes. */
export async function finish(doc: Doc, footer: string): Promise<Buffer> {
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<void>((resolve, reject) => {
    doc.on('end', resolve);
    doc.on('error', reject);
  });
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i += 1) {
    doc.switchToPage(i);
    const bottom = doc.page.height - MARGIN + 4;
    const width = doc.page.width - 2 * MARGIN;
    // Writing inside the bottom margin must not start a new page.
    const margin = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .font('sans')
      .fontSize(8)
      .fillColor(PENCIL)
      .text(footer, MARGIN, bottom, { width: width - 60, lineBreak: true });
    doc.text(`page ${i + 1} of ${range.count}`, MARGIN + width - 60, bottom, {
      width: 60,
      align: 'right',
    });
    doc.page.margins.bottom = margin;
  }
  doc.end();
  await done;
  return Buffer.concat(chunks);
}

/** Characters the embedded Plex subsets lack, written with ones they have. */
export function printable(text: string): string {
  return text.replace(/→/g, '>').replace(/[✓✔]/g, 'done');
}

/** Plex Mono advances every character 600/1000 em. */
export const MONO_ADVANCE = 0.6;

/** Monospace text at (x, y), each run of non-spaces placed by its column; returns the width. */
export function monoText(
  doc: Doc,
  text: string,
  x: number,
  y: number,
  options: { size?: number; color?: string; bold?: boolean } = {},
): number {
  const size = options.size ?? 11;
  const line = printable(text);
  doc
    .font(options.bold ? 'monoBold' : 'mono')
    .fontSize(size)
    .fillColor(options.color ?? INK);
  for (const m of line.matchAll(/\S+/g))
    doc.text(m[0], x + m.index * size * MONO_ADVANCE, y, { lineBreak: false });
  doc.font('sans').fontSize(10.5).fillColor(INK);
  return line.length * size * MONO_ADVANCE;
}

export function heading(doc: Doc, text: string): void {
  ensureRoom(doc, 60);
  doc.moveDown(0.8).font('sansBold').fontSize(14).fillColor(INK);
  doc.text(printable(text), MARGIN, doc.y, { width: doc.page.width - 2 * MARGIN });
  doc.moveDown(0.3).font('sans').fontSize(10.5);
}

/** Starts a new page when fewer than `points` remain. */
export function ensureRoom(doc: Doc, points: number): void {
  if (doc.y + points > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

/** An empty box to tick on paper, at the current line. */
export function checkbox(doc: Doc, x: number, y: number): void {
  doc
    .save()
    .lineWidth(0.8)
    .strokeColor(INK)
    .rect(x, y + 1.5, 9, 9)
    .stroke()
    .restore();
}

/**
 * A working at (x, y) within `width`: its digit rows in monospace on faint squared paper
 * (rules drawn as lines, the row `highlightLine` on a soft highlight), and its lines of
 * words (regrouping notes, partial products in words) as small text under the grid.
 * Returns the height used.
 */
export function working(
  doc: Doc,
  lines: readonly string[],
  x: number,
  y: number,
  options: { color?: string; highlightLine?: number | null; width?: number } = {},
): number {
  const size = 11;
  const lineHeight = 15;
  const cell = size * MONO_ADVANCE;
  const width = options.width ?? 220;
  const isWords = (l: string) => /[A-Za-z]{3,}/.test(l);
  const rows = lines.filter((l) => !isWords(l));
  const words = lines.filter(isWords);
  const cols = Math.min(Math.floor(width / cell), Math.max(8, ...rows.map((l) => l.length)) + 1);
  const height = rows.length * lineHeight + 6;
  doc.save().lineWidth(0.3).strokeColor('#e3e7ef');
  for (let c = 0; c <= cols; c += 1)
    doc
      .moveTo(x + c * cell, y)
      .lineTo(x + c * cell, y + height)
      .stroke();
  for (let r = 0; r * lineHeight <= height; r += 1)
    doc
      .moveTo(x, y + r * lineHeight)
      .lineTo(x + cols * cell, y + r * lineHeight)
      .stroke();
  doc.restore();
  const highlighted = options.highlightLine == null ? null : lines[options.highlightLine];
  rows.forEach((line, i) => {
    const top = y + 3 + i * lineHeight;
    if (/^─+$/.test(line)) {
      doc
        .save()
        .lineWidth(1)
        .strokeColor(options.color ?? INK)
        .moveTo(x + cell * 0.5, top + lineHeight / 2)
        .lineTo(x + cell * (Math.min(line.length, cols - 1) + 0.5), top + lineHeight / 2)
        .stroke()
        .restore();
      return;
    }
    if (highlighted !== null && line === highlighted)
      doc
        .save()
        .fillColor(HIGHLIGHT)
        .rect(x, top - 2, cols * cell, lineHeight)
        .fill()
        .restore();
    monoText(doc, line.slice(0, cols - 1), x, top, {
      size,
      color: options.color ?? INK,
    });
  });
  let used = height;
  doc
    .font('sans')
    .fontSize(8.5)
    .fillColor(options.color ?? PENCIL);
  for (const line of words) {
    const text = printable(line);
    doc.text(text, x, y + used + 2, { width });
    used += doc.heightOfString(text, { width }) + 2;
  }
  doc.fillColor(INK).font('sans').fontSize(10.5);
  return used;
}

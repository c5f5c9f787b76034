import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import PDFDocument from 'pdfkit';
import { describe, expect, it } from 'vitest';
import { woffToSfnt } from './woff.js';

const require = createRequire(import.meta.url);
const file = (pkg: string, name: string) =>
  path.join(path.dirname(require.resolve(`${pkg}/LICENSE`)), 'files', name);

const FACES = [
  file('@fontsource/ibm-plex-sans', 'ibm-plex-sans-latin-400-normal.woff'),
  file('@fontsource/ibm-plex-sans', 'ibm-plex-sans-latin-600-normal.woff'),
  file('@fontsource/ibm-plex-mono', 'ibm-plex-mono-latin-400-normal.woff'),
];

describe('woffToSfnt', () => {
  // The reference is fontkit's own WOFF reader (inside pdfkit): the unwrapped font must
  // measure every string exactly as the WOFF it came from.
  it.each(FACES)('unwraps %s into a font that measures text as the WOFF does', (woffPath) => {
    const woff = readFileSync(woffPath);
    const sfnt = woffToSfnt(woff);
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
    const doc = new PDFDocument();
    // No spaces: fontkit fails on Plex Mono's empty space glyph either way (pdf-document.ts).
    for (const text of ['304−75=229', '7×8÷2', 'Wren’s', 'week3']) {
      const fromWoff = doc.font(woff).fontSize(12).widthOfString(text);
      const fromSfnt = doc.font(sfnt).fontSize(12).widthOfString(text);
      expect(fromSfnt).toBe(fromWoff);
      expect(fromSfnt).toBeGreaterThan(0);
    }
    doc.end();
  });

  it('refuses what is not WOFF 1.0', () => {
    expect(() => woffToSfnt(Buffer.from('wOF2 not this one'))).toThrow(/WOFF 1.0/);
  });
});

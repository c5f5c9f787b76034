// Draws Workback's home-screen icons (our own design: the brand mark, a teal sheet of squared
// paper with one square marked in yellow) and writes them as PNGs into public/icons.
// Run once after changing the design: node packages/web/scripts/make-icons.mjs
import { mkdirSync } from 'node:fs';
import sharp from 'sharp';

const OUT = new URL('../public/icons/', import.meta.url);
const ACCENT = '#1c6e62';
const HIGHLIGHT = '#fcebb6';

/** A path that runs back along the sheet and turns up to the marked square: working back. */
function arrow(inset, cell) {
  const at = (x, y) => `${inset + x * cell} ${inset + y * cell}`;
  return [
    `M${at(4.9, 4.5)}`,
    `L${at(2.1, 4.5)}`,
    `A${cell} ${cell} 0 0 1 ${at(2.1, 2.5)}`,
    `L${at(2.75, 2.5)}`,
    `M${at(2.35, 2.05)}`,
    `L${at(2.8, 2.5)}`,
    `L${at(2.35, 2.95)}`,
  ].join(' ');
}

/** The mark on a 512 grid; `safe` shrinks it into the middle for maskable icons. */
function svg({ safe }) {
  const size = 512;
  const inset = safe ? 80 : 0;
  const inner = size - inset * 2;
  const cell = inner / 6;
  const lines = [];
  for (let i = 1; i < 6; i++) {
    const p = inset + i * cell;
    lines.push(`<line x1="${inset}" y1="${p}" x2="${inset + inner}" y2="${p}" />`);
    lines.push(`<line x1="${p}" y1="${inset}" x2="${p}" y2="${inset + inner}" />`);
  }
  const mark = { x: inset + 3 * cell, y: inset + 2 * cell };
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 ${size} ${size}">
  <rect width="${size}" height="${size}" fill="${ACCENT}" />
  <rect x="${mark.x + 6}" y="${mark.y + 6}" width="${cell - 12}" height="${cell - 12}" rx="10" fill="${HIGHLIGHT}" />
  <g stroke="#ffffff" stroke-opacity="0.35" stroke-width="6">${lines.join('')}</g>
  <path d="${arrow(inset, cell)}" fill="none" stroke="#ffffff" stroke-width="${cell * 0.34}"
    stroke-linecap="round" stroke-linejoin="round" />
  <rect y="${size - 40}" width="${size}" height="40" fill="#000000" fill-opacity="0.12" />
</svg>`;
}

mkdirSync(OUT, { recursive: true });
const plain = Buffer.from(svg({ safe: false }));
const maskable = Buffer.from(svg({ safe: true }));
const jobs = [
  ['icon-192.png', plain, 192],
  ['icon-512.png', plain, 512],
  ['icon-maskable-512.png', maskable, 512],
  ['apple-touch-icon.png', plain, 180],
];
for (const [name, source, size] of jobs) {
  await sharp(source)
    .resize(size, size)
    .png({ compressionLevel: 9, palette: true })
    .toFile(new URL(name, OUT).pathname);
  console.log(`wrote public/icons/${name}`);
}

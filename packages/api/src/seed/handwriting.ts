// Invented "handwritten" working for the demo photos: digits drawn as jittered pencil strokes
// on squared paper. No fonts, no real child's work.

const GLYPHS: Record<string, string> = {
  '0': 'M5 1 C1 1 0 5 0 8 C0 12 2 15 5 15 C8 15 10 12 10 8 C10 4 8 1 5 1',
  '1': 'M3 4 L6 1 L6 15',
  '2': 'M1 4 C2 0 9 0 9 4 C9 8 1 11 0 15 L10 15',
  '3': 'M1 2 C4 0 9 0 9 4 C9 7 5 7 4 7 C6 7 10 8 10 11 C10 16 2 16 0 13',
  '4': 'M7 15 L7 1 L0 10 L10 10',
  '5': 'M9 1 L2 1 L1 7 C4 5 10 6 10 10 C10 15 3 16 0 13',
  '6': 'M8 1 C3 2 0 6 0 10 C0 14 3 15 5 15 C8 15 10 13 10 10 C10 7 7 6 5 6 C3 6 1 8 0 10',
  '7': 'M0 1 L10 1 L4 15',
  '8': 'M5 7 C1 7 1 1 5 1 C9 1 9 7 5 7 C0 7 0 15 5 15 C10 15 10 7 5 7',
  '9': 'M10 6 C10 2 7 1 5 1 C2 1 0 3 0 5 C0 8 3 9 5 9 C7 9 10 8 10 6 L9 15',
  '-': 'M1 8 L9 8',
  '+': 'M1 8 L9 8 M5 4 L5 12',
  x: 'M2 4 L8 12 M8 4 L2 12',
  '=': 'M1 6 L9 6 M1 10 L9 10',
  '?': 'M1 4 C1 0 9 0 9 4 C9 7 5 7 5 10 M5 14 L5 15',
};

export interface Working {
  /** A column problem (`304 - 75`), a fact (`7 x 8`), or words the checkers do not read. */
  problem: string;
  answer: string;
  seed: number;
}

const W = 720;
const H = 900;
const CELL = 60;

/** An SVG of the problem and the child's answer, as written in pencil on squared paper. */
export function drawWorking({ problem, answer, seed }: Working): string {
  const rand = mulberry32(seed);
  const strokes: string[] = [];
  const write = (text: string, x: number, y: number, size = 1) => {
    let cx = x;
    for (const ch of text) {
      const glyph = GLYPHS[ch];
      if (glyph) strokes.push(jitterPath(glyph, cx, y, size, rand));
      cx += CELL * size;
    }
  };
  const column = /^\s*(\d+)\s*([-+x×])\s*(\d+)\s*$/.exec(problem);
  if (column && Math.max(column[1]!.length, column[3]!.length) > 1) {
    const [, top, op, bottom] = column as unknown as [string, string, string, string];
    const width = Math.max(top.length, bottom.length + 1, answer.length);
    const right = 160 + width * CELL;
    write(top, right - top.length * CELL, 200);
    write(op === '×' ? 'x' : op, right - width * CELL - 10, 320);
    write(bottom, right - bottom.length * CELL, 320);
    strokes.push(
      `<path d="M${right - width * CELL - 30} ${425 + rand() * 6} L${right + 10} ${420 + rand() * 6}" />`,
    );
    write(answer.replace(/\D/g, ''), right - answer.replace(/\D/g, '').length * CELL, 470);
  } else if (/^[\d\s+\-x×=?]+$/.test(problem)) {
    write(`${problem.replace(/\s+/g, '').replace('×', 'x')}=${answer}`, 90, 360);
  } else {
    // A word problem: scribbled lines of "text", then the answer.
    for (let line = 0; line < 4; line++) {
      const y = 170 + line * 70;
      let d = `M80 ${y}`;
      for (let x = 80; x < 600 - line * 60; x += 18)
        d += ` Q${x + 9} ${y - 14 - rand() * 8} ${x + 18} ${y + rand() * 4}`;
      strokes.push(`<path d="${d}" stroke-width="3" />`);
    }
    write(answer.replace(/[^\d]/g, ''), 380, 520);
  }
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs><pattern id="grid" width="30" height="30" patternUnits="userSpaceOnUse">
    <path d="M30 0 L0 0 0 30" fill="none" stroke="#c9d6e8" stroke-width="1" /></pattern></defs>
  <rect width="${W}" height="${H}" fill="#fbf9f2" />
  <rect width="${W}" height="${H}" fill="url(#grid)" />
  <g fill="none" stroke="#4a4f57" stroke-width="5" stroke-linecap="round" stroke-linejoin="round" opacity="0.88">
    ${strokes.join('\n    ')}
  </g>
</svg>`;
}

function jitterPath(d: string, x: number, y: number, size: number, rand: () => number): string {
  const scale = 4.6 * size;
  const slant = 0.12 + rand() * 0.08;
  const dx = (rand() - 0.5) * 6;
  const dy = (rand() - 0.5) * 8;
  const tokens = d.split(/\s+/);
  const out: string[] = [];
  for (const token of tokens) {
    const cmd = /^[A-Z]/.exec(token)?.[0] ?? '';
    const rest = cmd ? token.slice(1) : token;
    out.push(cmd);
    if (rest === '') continue;
    const n = Number(rest);
    out.push(String(n));
  }
  // Re-pair numbers into points and move each a little, as a hand does.
  const parts: string[] = [];
  let pending: number | null = null;
  for (const t of out) {
    if (t === '') continue;
    if (/^[A-Z]$/.test(t)) {
      parts.push(t);
      continue;
    }
    const n = Number(t);
    if (pending === null) {
      pending = n;
    } else {
      const px = pending;
      const py = n;
      const ax = x + dx + (px + (16 - py) * slant) * scale + (rand() - 0.5) * 3;
      const ay = y + dy + py * scale + (rand() - 0.5) * 3;
      parts.push(`${ax.toFixed(1)} ${ay.toFixed(1)}`);
      pending = null;
    }
  }
  return `<path d="${parts.join(' ')}" />`;
}

function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

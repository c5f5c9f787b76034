/** Longest range of lessons one entry may name (`1-200` is a typo, not a plan). */
const MAX_RANGE = 60;

const SINGLE = /^(\d{1,4})$/;
const RANGE = /^(\d{1,4})\s*[-–]\s*(\d{1,4})$/;

export type RevisitRead =
  { ok: true; entries: string[]; lessons: number[] } | { ok: false; message: string };

/**
 * Reads lessons to revisit written as numbers and ranges, normalised and in order:
 * `['12', '31 – 33']` → `{ entries: ['12', '31-33'], lessons: [12, 31, 32, 33] }`.
 */
export function readRevisit(raw: readonly string[]): RevisitRead {
  const entries: string[] = [];
  const lessons = new Set<number>();
  for (const text of raw.map((r) => r.trim()).filter(Boolean)) {
    const single = SINGLE.exec(text);
    const range = RANGE.exec(text);
    let from: number;
    let to: number;
    if (single) {
      from = to = Number(single[1]);
    } else if (range) {
      from = Number(range[1]);
      to = Number(range[2]);
      if (from > to) {
        return { ok: false, message: `range “${text}” runs backwards; write ${to}-${from}` };
      }
      if (to - from >= MAX_RANGE) {
        return { ok: false, message: `range “${text}” spans more than ${MAX_RANGE} lessons` };
      }
    } else {
      return {
        ok: false,
        message: `“${text}” is not a lesson number or a range such as 31-33`,
      };
    }
    if (from < 1) return { ok: false, message: `“${text}”: lesson numbers start at 1` };
    const entry = from === to ? String(from) : `${from}-${to}`;
    if (!entries.includes(entry)) entries.push(entry);
    for (let n = from; n <= to; n++) lessons.add(n);
  }
  return { ok: true, entries, lessons: [...lessons].sort((a, b) => a - b) };
}

/**
 * Lesson numbers deduplicated, ordered and merged into runs of consecutive lessons.
 * `lessonRanges([20, 13, 12, 14, 13])` → `[{ from: 12, to: 14 }, { from: 20, to: 20 }]`.
 */
export function lessonRanges(lessons: readonly number[]): { from: number; to: number }[] {
  const sorted = [...new Set(lessons.filter((n) => Number.isInteger(n) && n > 0))].sort(
    (a, b) => a - b,
  );
  const out: { from: number; to: number }[] = [];
  for (const n of sorted) {
    const last = out.at(-1);
    if (last !== undefined && n === last.to + 1) last.to = n;
    else out.push({ from: n, to: n });
  }
  return out;
}

/**
 * Ranges written the way a parent reads them, with an en dash.
 * `formatLessonRanges([{ from: 12, to: 14 }, { from: 20, to: 20 }])` → `'12–14, 20'`.
 */
export function formatLessonRanges(
  ranges: readonly { readonly from: number; readonly to: number }[],
): string {
  return ranges.map((r) => (r.from === r.to ? `${r.from}` : `${r.from}–${r.to}`)).join(', ');
}

/** A basic fact in a working, placed at power-of-ten position `position` of the result. */
export interface FactCell<T> {
  readonly position: number;
  /** The fact's correct result. */
  readonly value: number;
  readonly data: T;
}

/**
 * Finds the one basic fact that, written wrongly with the rest of the (correct, exact)
 * working unchanged, turns the right result into the child's. Column methods are exact
 * sums of their facts shifted by powers of ten, so one fact off by δ changes the result by
 * δ × 10^position. `plausible` says which wrong results count (see `wrongFacts`). Prefers
 * the smallest slip, then the rightmost fact.
 * `findFactSlip(-2n * 10n ** 0n, cells)` → the ones-column cell with `written: value − 2`.
 */
export function findFactSlip<T>(
  difference: bigint,
  cells: readonly FactCell<T>[],
  plausible: (cell: FactCell<T>, written: number) => boolean,
): { cell: FactCell<T>; written: number } | null {
  if (difference === 0n) return null;
  let best: { cell: FactCell<T>; written: number; size: number } | null = null;
  for (const cell of cells) {
    const unit = 10n ** BigInt(cell.position);
    if (difference % unit !== 0n) continue;
    const delta = difference / unit;
    if (delta > 1000n || delta < -1000n) continue;
    const written = cell.value + Number(delta);
    if (!plausible(cell, written)) continue;
    const size = Math.abs(Number(delta));
    if (best === null || size < best.size) best = { cell, written, size };
  }
  return best === null ? null : { cell: best.cell, written: best.written };
}

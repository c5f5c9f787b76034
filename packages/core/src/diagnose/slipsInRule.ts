/** One basic fact a method works out, where a slip could sit. */
export interface SlipSite<S> {
  /** The power of ten at which the fact's result is first written in the final answer. */
  readonly position: number;
  /** The fact's right result. */
  readonly right: number;
  /** The wrong results to try (from `wrongFacts`). */
  readonly wrong: readonly number[];
  /** The method option that makes the fact come out as `written`. */
  readonly slip: (written: number) => S;
}

/** The lowest power of ten at which two whole numbers (digit strings) differ; -1 when equal. */
function lowestDifference(a: string, b: string): number {
  const width = Math.max(a.length, b.length);
  for (let k = 0; k < width; k += 1)
    if ((a[a.length - 1 - k] ?? '0') !== (b[b.length - 1 - k] ?? '0')) return k;
  return -1;
}

/**
 * Finds every single basic-fact slip which, made inside a method (a rule's own working, its
 * effect carried on to the left), turns `methodResult` into `answer`. A slip changes nothing
 * to the right of where it is written, so only facts at or right of the lowest differing
 * digit are tried. Smaller slips first: `rank` is how far the written result is from the
 * right one (taken as 9 or as 7 for 8 are equally small; the single-fact check measures
 * slips the same way).
 * `slipsInRule('998', '999', sites, run)` → `[{ site: onesSite, written: 9 }]` for 923 − 35
 * worked without reducing the lending digit, 13 − 5 taken as 9.
 */
export function slipsInRule<T extends SlipSite<unknown>>(
  methodResult: string,
  answer: string,
  sites: readonly T[],
  run: (slip: ReturnType<T['slip']>) => string | null,
): { site: T; written: number; rank: number }[] {
  const lowest = lowestDifference(methodResult, answer);
  if (lowest < 0) return [];
  const out: { site: T; written: number; rank: number }[] = [];
  for (const site of sites) {
    if (site.position > lowest) continue;
    for (const w of site.wrong)
      if (run(site.slip(w) as ReturnType<T['slip']>) === answer)
        out.push({ site, written: w, rank: Math.abs(w - site.right) });
  }
  out.sort((x, y) => x.rank - y.rank);
  return out;
}

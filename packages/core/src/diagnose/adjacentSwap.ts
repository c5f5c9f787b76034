/**
 * Whether `written` is `expected` with two neighbouring digits exchanged (a careless swap
 * when writing the answer down), and which: the two digits as written, left to right.
 * `adjacentSwap('659', '569')` → `{ expected: '65', written: '56' }`; `adjacentSwap('43', '47')` → `null`.
 */
export function adjacentSwap(
  expected: string,
  written: string,
): { expected: string; written: string } | null {
  if (expected.length !== written.length || expected === written) return null;
  let first = -1;
  for (let i = 0; i < expected.length; i += 1) {
    if (expected[i] === written[i]) continue;
    if (first >= 0) return i === first + 1 ? check(first) : null;
    first = i;
  }
  return null;

  function check(i: number): { expected: string; written: string } | null {
    for (let k = i + 2; k < expected.length; k += 1) if (expected[k] !== written[k]) return null;
    if (expected[i] !== written[i + 1] || expected[i + 1] !== written[i]) return null;
    return { expected: expected.slice(i, i + 2), written: written.slice(i, i + 2) };
  }
}

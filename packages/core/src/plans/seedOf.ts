/**
 * A 32-bit seed from a text (FNV-1a), so a plan's practice problems are the same every
 * time the plan is printed. `seedOf('plan:7:sub.borrow-across-zero')` → a fixed number.
 */
export function seedOf(text: string): number {
  let hash = 0x811c9dc5;
  for (let i = 0; i < text.length; i += 1) {
    hash ^= text.charCodeAt(i);
    hash = Math.imul(hash, 0x01000193) >>> 0;
  }
  return hash >>> 0;
}

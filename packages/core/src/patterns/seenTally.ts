import type { PatternMiss, Seen } from './types.js';

/**
 * Collects, per key, the misses that show it (each miss once per key), and gives each key's
 * count, first and last day and miss ids, oldest first.
 * `seenTally(misses, (m) => m.skills).get('rounding')` → `{ count: 2, firstSeen: '2026-03-02', … }`.
 */
export function seenTally(
  misses: readonly PatternMiss[],
  keysOf: (miss: PatternMiss) => Iterable<string>,
): Map<string, Seen> {
  const byKey = new Map<string, PatternMiss[]>();
  for (const miss of byDay(misses)) {
    for (const key of new Set(keysOf(miss))) {
      const list = byKey.get(key) ?? [];
      list.push(miss);
      byKey.set(key, list);
    }
  }
  const out = new Map<string, Seen>();
  for (const [key, list] of byKey) {
    out.set(key, {
      count: list.length,
      firstSeen: list[0]!.occurredOn,
      lastSeen: list[list.length - 1]!.occurredOn,
      missIds: list.map((m) => m.id),
    });
  }
  return out;
}

/** Misses oldest first (ties by id), without changing the input. */
export function byDay<T extends { readonly occurredOn: string; readonly id: number }>(
  list: readonly T[],
): T[] {
  return [...list].sort((a, b) =>
    a.occurredOn === b.occurredOn ? a.id - b.id : a.occurredOn < b.occurredOn ? -1 : 1,
  );
}

/** Most seen first, then most recently seen, then by key. */
export function bySeen<T extends Seen>(key: (item: T) => string): (a: T, b: T) => number {
  return (a, b) =>
    b.count - a.count ||
    (a.lastSeen === b.lastSeen ? 0 : a.lastSeen > b.lastSeen ? -1 : 1) ||
    (key(a) < key(b) ? -1 : key(a) > key(b) ? 1 : 0);
}

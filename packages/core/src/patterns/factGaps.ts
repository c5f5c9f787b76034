import { factFamiliesOf } from './factFamiliesOf.js';
import { factFamilyLabel } from './factFamilyLabel.js';
import { factParts } from './factParts.js';
import { factText } from './factText.js';
import { byDay, bySeen, seenTally } from './seenTally.js';
import type { FactCount, FactGaps, FamilyCount, PatternMiss } from './types.js';

const GRID = 11;

/**
 * The fact gaps of a set of misses, from their diagnoses' wrong facts: the 0–10 addition
 * and multiplication grids (each cell the number of misses where that fact was wrong; a
 * fact and its turnaround share a count, and − and ÷ facts count in the grid of the fact
 * they undo), every wrong fact with what was written, and the families most often wrong.
 * `factGaps([missWith({ op: 'x', a: 7, b: 8, expected: 56, written: 54 })]).multiplication[7][8]` → `1`
 * (and `[8][7]` → `1`).
 */
export function factGaps(misses: readonly PatternMiss[]): FactGaps {
  const addition = emptyGrid();
  const multiplication = emptyGrid();
  const facts = new Map<string, { count: FactCount; written: number[] }>();
  // A fact and its turnaround are one entry (7 × 8 and 8 × 7), listed as first written.
  const keyOf = (f: { op: string; a: number; b: number }) =>
    f.op === '+' || f.op === 'x'
      ? `${f.op} ${Math.min(f.a, f.b)} ${Math.max(f.a, f.b)}`
      : `${f.op} ${f.a} ${f.b}`;
  for (const miss of byDay(misses)) {
    const seen = new Set<string>();
    for (const f of miss.diagnosis?.facts ?? []) {
      const key = keyOf(f);
      if (seen.has(key)) continue;
      seen.add(key);
      const [a, b, sign] = factParts(f);
      const grid = sign === 'x' ? multiplication : addition;
      if (a >= 0 && b >= 0 && a < GRID && b < GRID) {
        grid[a]![b]! += 1;
        if (a !== b) grid[b]![a]! += 1;
      }
      const had = facts.get(key);
      const written = [...(had?.written ?? []), f.written];
      facts.set(key, {
        written,
        count: {
          op: had?.count.op ?? f.op,
          a: had?.count.a ?? f.a,
          b: had?.count.b ?? f.b,
          expected: f.expected,
          text: had?.count.text ?? factText(f),
          written,
          families: factFamiliesOf(f),
          count: (had?.count.count ?? 0) + 1,
          firstSeen: had?.count.firstSeen ?? miss.occurredOn,
          lastSeen: miss.occurredOn,
          missIds: [...(had?.count.missIds ?? []), miss.id],
        },
      });
    }
  }
  const list = [...facts.values()].map((f) => f.count).sort(bySeen((f) => f.text));
  const familyTally = seenTally(misses, (m) =>
    (m.diagnosis?.facts ?? []).flatMap((f) => factFamiliesOf(f)),
  );
  const families: FamilyCount[] = [...familyTally]
    .map(([family, seen]) => ({
      family,
      label: factFamilyLabel(family),
      facts: list.filter((f) => f.families.includes(family)).map((f) => f.text),
      ...seen,
    }))
    .sort(bySeen((f) => f.family));
  return { addition, multiplication, list, families };
}

function emptyGrid(): number[][] {
  return Array.from({ length: GRID }, () => Array.from({ length: GRID }, () => 0));
}

import { Button, ButtonGroup } from '@blueprintjs/core';
import type { FactCount, FactGaps } from '@workback/core';
import { useState } from 'react';
import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { shortDay } from '../types';

type Grid = 'multiplication' | 'addition';

const SIGN: Readonly<Record<Grid, string>> = { multiplication: '×', addition: '+' };
const SIZE = Array.from({ length: 11 }, (_, i) => i);

/** `heatLevel(3)` → `3`: the shade of a cell, 0 (none) to 4 (five or more). */
export function heatLevel(count: number): number {
  if (count <= 0) return 0;
  if (count >= 5) return 4;
  return count >= 3 ? 3 : count;
}

/** The grid cell a wrong fact counts in: 56 ÷ 8 = 7 is the cell of 8 × 7; 15 − 8 = 7 of 8 + 7. */
export function cellOf(fact: Pick<FactCount, 'op' | 'a' | 'b' | 'expected'>): {
  grid: Grid;
  pair: [number, number];
} {
  switch (fact.op) {
    case 'x':
      return { grid: 'multiplication', pair: [fact.a, fact.b] };
    case '÷':
      return { grid: 'multiplication', pair: [fact.b, fact.expected] };
    case '+':
      return { grid: 'addition', pair: [fact.a, fact.b] };
    default:
      return { grid: 'addition', pair: [fact.b, fact.expected] };
  }
}

function factsInCell(list: readonly FactCount[], grid: Grid, a: number, b: number) {
  return list.filter((fact) => {
    const cell = cellOf(fact);
    const [x, y] = cell.pair;
    return cell.grid === grid && ((x === a && y === b) || (x === b && y === a));
  });
}

function times(count: number) {
  return count === 1 ? 'once' : count === 2 ? 'twice' : `${count} times`;
}

/**
 * The fact-gap grid: each cell is how often that basic fact was wrong (a fact and its
 * turnaround share a count), shaded softly and with its number, so colour is never the only cue.
 */
export function FactGrid({ facts }: { facts: FactGaps }) {
  const hasMultiplication = facts.multiplication.some((row) => row.some((n) => n > 0));
  const [grid, setGrid] = useState<Grid>(
    hasMultiplication || !facts.addition.some((row) => row.some((n) => n > 0))
      ? 'multiplication'
      : 'addition',
  );
  const [chosen, setChosen] = useState<[number, number] | null>(null);
  const cells = facts[grid];
  const sign = SIGN[grid];
  const picked = chosen ? factsInCell(facts.list, grid, chosen[0], chosen[1]) : [];

  return (
    <div className="wb-facts-panel">
      <ButtonGroup className="wb-grid-switch" aria-label="Which facts">
        {(['multiplication', 'addition'] as const).map((g) => (
          <Button
            key={g}
            active={grid === g}
            aria-pressed={grid === g}
            onClick={() => {
              setGrid(g);
              setChosen(null);
            }}
          >
            {g === 'multiplication' ? 'Multiplication ×' : 'Addition +'}
          </Button>
        ))}
      </ButtonGroup>
      <div className="wb-heat-scroll">
        <table className="wb-heat">
          <caption>
            {grid === 'multiplication' ? 'Multiplication' : 'Addition'} facts 0–10: how often each
            was wrong (division and subtraction facts count with their{' '}
            {grid === 'multiplication' ? 'multiplication' : 'addition'} fact)
          </caption>
          <thead>
            <tr>
              <th scope="col">
                <span aria-hidden>{sign}</span>
              </th>
              {SIZE.map((b) => (
                <th key={b} scope="col">
                  {b}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {SIZE.map((a) => (
              <tr key={a}>
                <th scope="row">{a}</th>
                {SIZE.map((b) => {
                  const count = cells[a]?.[b] ?? 0;
                  const isChosen = chosen !== null && chosen[0] === a && chosen[1] === b;
                  return (
                    <td key={b} className={`wb-heat-${heatLevel(count)}`}>
                      {count > 0 ? (
                        <button
                          type="button"
                          className={isChosen ? 'wb-heat-cell wb-heat-chosen' : 'wb-heat-cell'}
                          aria-pressed={isChosen}
                          onClick={() => setChosen(isChosen ? null : [a, b])}
                        >
                          {count}
                          <span className="wb-sr-label">
                            {' '}
                            wrong: {a} {sign} {b}
                          </span>
                        </button>
                      ) : (
                        <span className="wb-sr-label">none</span>
                      )}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div aria-live="polite">
        {chosen && picked.length > 0 ? (
          <ul className="wb-fact-detail" aria-label="The misses of this fact">
            {picked.map((fact) => (
              <li key={`${fact.op}${fact.a}${fact.b}`}>
                <strong className="wb-mono">
                  {fact.text} = {fact.expected}
                </strong>{' '}
                wrong {times(fact.count)} (written {fact.written.join(', ')}):{' '}
                {fact.missIds.map((id, index) => (
                  <Link
                    key={id}
                    to={paths.app.miss.getHref(id)}
                    className="wb-miss-number"
                    aria-label={`Open miss ${index + 1} of ${fact.text}`}
                  >
                    {index + 1}
                  </Link>
                ))}
                <span className="wb-muted"> last {shortDay(fact.lastSeen)}</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="wb-muted wb-grid-hint">Choose a number in the grid to see its misses.</p>
        )}
      </div>
      {facts.families.length > 0 ? (
        <ul className="wb-families" aria-label="Fact families to drill">
          {facts.families.map((family) => (
            <li key={family.family}>
              <strong>{family.label}</strong>: {family.facts.join(', ')}{' '}
              <span className="wb-muted">
                ({family.count === 1 ? '1 miss' : `${family.count} misses`})
              </span>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

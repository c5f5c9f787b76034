import type { ReactNode } from 'react';

/** One square of the paper: its text and how it is drawn. */
export type PaperCell = {
  text: ReactNode;
  /** Small figures written above (carries, borrows). */
  small?: boolean;
  /** Crossed out while regrouping. */
  struck?: boolean;
  /** A line drawn under this square (the answer line, a subtraction in long division). */
  ruled?: boolean;
  /** Quieter figures: placeholder zeros, operators. */
  quiet?: boolean;
  /** The digit that decides (rounding) or the place rounded to. */
  mark?: 'place' | 'decider' | 'bracket';
};

export type PaperRow = {
  cells: readonly (PaperCell | null)[];
  /** A row of small figures (carries and borrows). */
  small?: boolean;
  /** Highlight the whole row (e.g. the remainder). */
  differs?: boolean;
  /** The answer line under this row, across the whole width. */
  ruleBelow?: boolean;
};

export type PaperLayout = {
  width: number;
  rows: readonly PaperRow[];
  /** The column (from the left, 0-based) where the child's working first went differently. */
  differsAt: number | null;
};

/** `rightAligned('229', 5, 4)` → a row of 5 squares with 2, 2, 9 ending at square 4. */
export function rightAligned(
  text: string,
  width: number,
  end = width - 1,
  cell: Omit<PaperCell, 'text'> = {},
): (PaperCell | null)[] {
  const cells: (PaperCell | null)[] = Array.from({ length: width }, () => null);
  const chars = [...text];
  chars.forEach((char, i) => {
    const at = end - (chars.length - 1 - i);
    if (at >= 0 && at < width) cells[at] = { ...cell, text: char };
  });
  return cells;
}

function cellClass(cell: PaperCell | null, column: number, differsAt: number | null): string {
  const names = ['wb-paper-cell'];
  if (column === differsAt) names.push('is-differs');
  if (!cell) return names.join(' ');
  if (cell.small) names.push('is-small');
  if (cell.struck) names.push('is-struck');
  if (cell.ruled) names.push('is-ruled');
  if (cell.quiet) names.push('is-quiet');
  if (cell.mark) names.push(`is-${cell.mark}`);
  return names.join(' ');
}

/**
 * Squared paper: one figure a square, so the columns line up as the child wrote them. The
 * column where the working first went differently is softly shaded.
 */
export function Paper({ layout, label }: { layout: PaperLayout; label: string }) {
  const { width, rows, differsAt } = layout;
  return (
    <div className="wb-paper-scroll">
      <table className="wb-paper" aria-label={label}>
        <tbody>
          {rows.map((row, r) => (
            <tr
              key={r}
              className={
                [
                  row.small ? 'is-small-row' : '',
                  row.differs ? 'is-differs-row' : '',
                  row.ruleBelow ? 'is-rule-below' : '',
                ]
                  .filter(Boolean)
                  .join(' ') || undefined
              }
            >
              {Array.from({ length: width }, (_, c) => {
                const cell = row.cells[c] ?? null;
                return (
                  <td key={c} className={cellClass(cell, c, differsAt)}>
                    {cell?.struck ? <s>{cell.text}</s> : cell?.text}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { diagnose, type Diagnosis } from '@workback/core';
import { describe, expect, it } from 'vitest';

import { WorkingTrace } from './working-trace';

/** The real engine's findings; a problem these tests cannot read is a broken test. */
function diagnosed(problem: string, answer: string): Diagnosis {
  const result = diagnose(problem, answer);
  if (!result.ok) throw new Error(`diagnose could not read ${problem} / ${answer}`);
  return result;
}

function show(problem: string, answer: string) {
  const diagnosis = diagnosed(problem, answer);
  render(<WorkingTrace diagnosis={diagnosis} />);
  return diagnosis;
}

/** A squared-paper table as rows of cell texts ('' for an empty square). */
function paperRows(table: HTMLElement): string[][] {
  return [...table.querySelectorAll('tr')].map((tr) =>
    [...tr.querySelectorAll('td')].map((td) => td.textContent ?? ''),
  );
}

/** The squares of the column shaded as "went differently" in each row. */
function shadedColumn(table: HTMLElement): number[] {
  const first = table.querySelector('tr');
  return [...(first?.querySelectorAll('td') ?? [])].flatMap((td, i) =>
    td.classList.contains('is-differs') ? [i] : [],
  );
}

const usual = () => screen.getByRole('table', { name: 'The usual working' });
const childWorking = () =>
  screen.getByRole('table', { name: 'The child’s working, as this rule does it' });

describe('WorkingTrace', () => {
  it('column addition: the carry small above, the dropped carry in the child’s working', () => {
    show('58 + 67', '115');
    expect(paperRows(usual())).toEqual([
      ['', '', '1', ''],
      ['', '', '5', '8'],
      ['+', '', '6', '7'],
      ['', '1', '2', '5'],
    ]);
    expect(paperRows(childWorking())).toEqual([
      ['', '', '5', '8'],
      ['+', '', '6', '7'],
      ['', '1', '1', '5'],
    ]);
    expect(shadedColumn(usual())).toEqual([2]);
    expect(shadedColumn(childWorking())).toEqual([2]);
    expect(screen.getByRole('heading', { name: 'Carry dropped (addition)' })).toBeInTheDocument();
    expect(screen.getByText(/In the tens column the correct working gives 2/)).toBeInTheDocument();
  });

  it('column subtraction: each regrouping written above, the replaced digits crossed out', () => {
    show('304 - 75', '139');
    const rows = paperRows(usual());
    expect(rows).toEqual([
      ['', '', '9', ''],
      ['', '2', '10', '14'],
      ['', '3', '0', '4'],
      ['−', '', '7', '5'],
      ['', '2', '2', '9'],
    ]);
    const struck = [...usual().querySelectorAll('td.is-struck')].map((td) => td.textContent);
    expect(struck).toEqual(['10', '3', '0', '4']);
    // The child's way: the ten taken straight from the hundreds, the zero left a zero.
    expect(paperRows(childWorking()).at(-1)).toEqual(['', '1', '3', '9']);
    expect(shadedColumn(usual())).toEqual([2]);
    expect(screen.getByRole('heading', { name: /zero/i })).toBeInTheDocument();
  });

  it('long multiplication: partial products with a quiet placeholder zero, then their sum', () => {
    show('34 x 12', '102');
    expect(paperRows(usual()).slice(-5)).toEqual([
      ['', '', '3', '4'],
      ['×', '', '1', '2'],
      ['', '', '6', '8'],
      ['+', '3', '4', '0'],
      ['', '4', '0', '8'],
    ]);
    const placeholder = [...usual().querySelectorAll('td.is-quiet')].map((td) => td.textContent);
    expect(placeholder).toContain('0');
    // Without the placeholder the second partial product sits under the first.
    expect(paperRows(childWorking()).slice(-3)).toEqual([
      ['', '', '6', '8'],
      ['+', '', '3', '4'],
      ['', '1', '0', '2'],
    ]);
  });

  it('one-digit multiplication: the carry above the top number', () => {
    show('27 x 4', '168');
    expect(paperRows(usual())).toEqual([
      ['', '', '2', ''],
      ['', '', '2', '7'],
      ['×', '', '', '4'],
      ['', '1', '0', '8'],
    ]);
    expect(paperRows(childWorking()).at(-1)).toEqual(['', '1', '6', '8']);
  });

  it('zeros set aside and put back: said in words under the working', () => {
    show('400 x 30', '120000');
    expect(paperRows(childWorking()).at(-1)?.join('')).toBe('120000');
    expect(screen.getByText(/zeros at the ends were set aside/)).toBeInTheDocument();
  });

  it('long division: quotient over the bracket, the missing zero left blank in the child’s', () => {
    show('612 ÷ 6', '12');
    const rows = paperRows(usual());
    expect(rows[0]).toEqual(['', '', '1', '0', '2']);
    expect(rows[1]).toEqual(['6', ')', '6', '1', '2']);
    expect(rows.slice(2)).toEqual([
      ['', '−', '6', '', ''],
      ['', '', '', '1', ''],
      ['', '', '−', '0', ''],
      ['', '', '', '1', '2'],
      ['', '', '−', '1', '2'],
      ['', '', '', '', '0'],
    ]);
    expect(paperRows(childWorking())[0]).toEqual(['', '', '1', '', '2']);
    expect(shadedColumn(usual())).toEqual([3]);
    expect(screen.getAllByText(/Answer written:/)).toHaveLength(2);
  });

  it('long division: a remainder too large is shaded on its row', () => {
    show('45 ÷ 6', '6 R 9');
    const rows = paperRows(childWorking());
    expect(rows[0]).toEqual(['', '', '', '6']);
    expect(rows.at(-1)).toEqual(['', '', '', '9']);
    expect(shadedColumn(childWorking())).toEqual([3]);
    expect(within(usual()).getAllByRole('row')).toHaveLength(4);
    const usualFigure = usual().closest('figure');
    expect(usualFigure?.textContent).toContain('Answer written: 7 R 3');
  });

  it('rounding: the place marked, the deciding digit underlined, the rule in words', () => {
    show('round 3456 to nearest hundred', '3400');
    const table = usual();
    expect(paperRows(table).slice(1)).toEqual([
      ['3', '4', '5', '6'],
      ['3', '5', '0', '0'],
    ]);
    expect(table.querySelector('td.is-place')?.textContent).toBe('4');
    expect(table.querySelector('td.is-decider')?.textContent).toBe('5');
    expect(shadedColumn(table)).toEqual([1]);
    expect(paperRows(childWorking()).at(-1)).toEqual(['3', '4', '0', '0']);
    const childFigure = childWorking().closest('figure') as HTMLElement;
    expect(within(childFigure).getByText(/The hundreds digit 4 was kept/)).toBeInTheDocument();
  });

  it('rounding step by step: the in-between value shown once', () => {
    show('round 3449 to nearest hundred', '3500');
    expect(paperRows(childWorking()).slice(1)).toEqual([
      ['3', '4', '4', '9'],
      ['3', '4', '5', '0'],
      ['3', '5', '0', '0'],
    ]);
  });

  it('missing number: the inverse sum with its own working, the check only in the usual one', () => {
    show('90 - ? = 35', '125');
    const usualGroup = screen.getByRole('group', { name: 'The usual working' });
    expect(within(usualGroup).getByText('90 − 35 = 55')).toBeInTheDocument();
    expect(within(usualGroup).getByText('90 − 55 = 35')).toBeInTheDocument();
    const child = screen.getByRole('group', { name: 'The child’s working, as this rule does it' });
    expect(within(child).getByText('90 + 35 = 125')).toBeInTheDocument();
    expect(within(child).queryByText(/Check/)).toBeNull();
    const childTable = within(child).getByRole('table');
    expect(paperRows(childTable).at(-1)).toEqual(['', '1', '2', '5']);
  });

  it('adding fractions: over a common denominator in the usual working, across in the child’s', () => {
    show('1/2 + 1/3', '2/5');
    const usualChain = screen.getByLabelText('The usual working');
    expect(usualChain.textContent).toBe('1/2 + 1/3=3/6×3 + 2/6×2=5/6');
    const child = screen.getByLabelText('The child’s working, as this rule does it');
    expect(child.textContent).toBe('1/2 + 1/3=2/5');
    expect(child.querySelector('.is-differs')?.textContent).toBe('5');
  });

  it('comparing fractions: the sign shaded, and how each side compared', () => {
    show('1/3 ? 1/5', '<');
    const child = screen.getByLabelText('The child’s working, as this rule does it');
    expect(child.querySelector('.is-differs')?.textContent).toBe('<');
    expect(screen.getByText(/compares the bottom numbers only: 3 and 5/)).toBeInTheDocument();
    expect(screen.getByText(/Both over 15/)).toBeInTheDocument();
  });

  it('no known rule: the child’s bare answer under the problem, and a plain word about it', () => {
    show('23 x 45', '1000');
    const table = screen.getByRole('table', { name: 'The child’s answer' });
    expect(paperRows(table)).toEqual([
      ['', '', '', '2', '3'],
      ['×', '', '', '4', '5'],
      ['', '1', '0', '0', '0'],
    ]);
    expect(
      screen.getByText(/None of the known step errors gives exactly this answer/),
    ).toBeVisible();
  });

  it('a basic fact: named with what it was taken as', () => {
    show('7 x 8', '54');
    expect(screen.getByText('7 × 8 = 56 (taken as 54)')).toBeInTheDocument();
  });

  it('a rule with a slip in its own column: one story, numbers with thousands commas (issue 11 §4)', () => {
    show('960 + 4455', '4325');
    const verdict = screen.getByText(/The usual working gives/);
    // The usual answer in the sentence with a comma; the child's answer as the parent typed it.
    expect(verdict).toHaveTextContent('The usual working gives 5,415; the answer written is 4325.');
    expect(
      screen.getByText(
        'Two things happened together. In the tens column 6 + 5 was taken as 12 instead of 11: the 2 was written, but the 1 that belongs in the hundreds column was not carried. Worked that way, 960 + 4,455 gives 4,325.',
      ),
    ).toBeInTheDocument();
  });

  it('a right answer: said plainly, the usual working shown, no rule', () => {
    show('81 - 38', '43');
    expect(screen.getByText(/This answer is right/)).toBeInTheDocument();
    expect(paperRows(usual()).at(-1)).toEqual(['', '4', '3']);
    expect(screen.queryByRole('heading')).toBeNull();
  });

  it('keeps the nines and elevens checks folded, with the caveat when opened', async () => {
    const diagnosis = show('304 - 75', '139');
    const toggle = screen.getByRole('button', { name: /casting out nines and elevens/ });
    expect(toggle).toHaveAttribute('aria-expanded', 'false');
    await userEvent.setup().click(toggle);
    expect(toggle).toHaveAttribute('aria-expanded', 'true');
    const nines = diagnosis.checks.nines;
    if (!nines.applies) throw new Error('nines should apply to subtraction');
    expect(screen.getByText(nines.verdict)).toBeVisible();
    expect(screen.getAllByText(nines.caveat)[0]).toBeVisible();
    expect(screen.getByText(/not a grade or an assessment of your child/)).toBeInTheDocument();
  });
});

describe('WorkingTrace for decimals, money and clock times (issue 16)', () => {
  it('draws the point after the ones digit of every row, the columns lined up', () => {
    show('12.50 - 3.75', '19.85');
    const rows = paperRows(usual()).filter((r) => r.some((c) => /\d/.test(c)));
    const figures = rows.slice(-3).map((r) => r.join('').replace(/\s/g, ''));
    expect(figures).toEqual(['12.50', '−3.75', '8.75']);
    // The tenths column, where the child's working first went differently, is shaded.
    expect(shadedColumn(usual()).length).toBe(1);
  });

  it('draws dec.right-aligned as the child lined it up: last digits under each other, the points apart', () => {
    // 4.5 + 2.25 → 2.70 is the issue's own example of dec.right-aligned (issue 16).
    show('4.5 + 2.25', '2.70');
    const child = screen.getByRole('table', { name: 'The child’s working, as this rule does it' });
    const rows = paperRows(child).map((r) => r.map((c) => c.replace(/\s/g, '')));
    expect(rows).toEqual([
      ['', '', '4.', '5'],
      ['+', '2.', '2', '5'],
      ['', '2.', '7', '0'],
    ]);
    // The points stand in different columns: the leftmost of them is shaded.
    expect(shadedColumn(child)).toEqual([1]);
    expect(screen.getByText(/Lined up by the last digits/)).toBeVisible();
    // The usual working still lines the points up.
    const usualRows = paperRows(usual()).filter((r) => r.some((c) => /\d/.test(c)));
    expect(usualRows.map((r) => r.join('').replace(/\s/g, ''))).toEqual(['4.50', '+2.25', '6.75']);
  });

  it('writes the steps of a clock problem', () => {
    show('3:15 - 1:50', '1:65');
    expect(screen.getAllByText(/1 h taken as 60 min/).length).toBeGreaterThan(0);
    expect(screen.getAllByText(/1 h taken as 100 min/).length).toBeGreaterThan(0);
  });

  it('says how a decimal comparison was made', () => {
    show('0.45 ? 0.5', '>');
    expect(
      screen.getAllByText(/more digits after the point taken as larger/).length,
    ).toBeGreaterThan(0);
    expect(screen.getAllByText(/0\.45 < 0\.50/).length).toBeGreaterThan(0);
  });
});

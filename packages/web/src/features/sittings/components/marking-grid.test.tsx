import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';

import type { MarkableItem } from '../types';
import { MarkingGrid } from './marking-grid';

const items: MarkableItem[] = [
  { id: 11, number: 1, prompt: '58 + 67', answer: '125', revisitLessons: [3], facts: [] },
  { id: 12, number: 2, prompt: '304 - 75', answer: '229', revisitLessons: [14, 15], facts: [] },
  { id: 13, number: 3, prompt: '27 x 4', answer: '108', revisitLessons: [10], facts: ['fours'] },
  { id: 14, number: 4, prompt: '45 ÷ 6', answer: '7 R 3', revisitLessons: [11], facts: [] },
];

function renderGrid(onSave = vi.fn()) {
  render(<MarkingGrid items={items} saved={[]} saving={false} onSave={onSave} />);
  return { onSave, user: userEvent.setup() };
}

const rightButton = (n: number) => screen.getByRole('button', { name: `Item ${n} right` });
const wrongButton = (n: number) => screen.getByRole('button', { name: `Item ${n} wrong` });
const score = () => screen.getByRole('status');

describe('MarkingGrid', () => {
  it('marks with one key press per item and types the child’s answer only for wrong ones', async () => {
    const { onSave, user } = renderGrid();
    rightButton(1).focus();
    expect(score()).toHaveTextContent('0 right, 0 wrong · 4 to mark');

    await user.keyboard('1');
    expect(rightButton(1)).toHaveAttribute('aria-pressed', 'true');
    expect(rightButton(2)).toHaveFocus();

    await user.keyboard('2');
    expect(wrongButton(2)).toHaveAttribute('aria-pressed', 'true');
    const answer = screen.getByRole('textbox', { name: 'What the child wrote for item 2' });
    expect(answer).toHaveFocus();
    // Digits typed here are the child's answer, not marks.
    await user.keyboard('139{Enter}');
    expect(answer).toHaveValue('139');
    expect(rightButton(3)).toHaveFocus();
    expect(rightButton(3)).toHaveAttribute('aria-pressed', 'false');

    await user.keyboard('w');
    await user.keyboard('168{Enter}');
    await user.keyboard('1');
    expect(score()).toHaveTextContent('2 right, 2 wrong · all marked');
    // Only wrong items have an answer box.
    expect(screen.getAllByRole('textbox')).toHaveLength(2);

    await user.click(screen.getByRole('button', { name: 'Save marks' }));
    expect(onSave).toHaveBeenCalledWith([
      { keyItemId: 11, correct: true, answer: null },
      { keyItemId: 12, correct: false, answer: '139' },
      { keyItemId: 13, correct: false, answer: '168' },
      { keyItemId: 14, correct: true, answer: null },
    ]);
  });

  it('moves with the arrow keys without marking, and a second press changes a mark', async () => {
    const { user } = renderGrid();
    rightButton(1).focus();
    await user.keyboard('{ArrowDown}{ArrowDown}');
    expect(rightButton(3)).toHaveFocus();
    await user.keyboard('{ArrowUp}');
    expect(rightButton(2)).toHaveFocus();
    expect(score()).toHaveTextContent('0 right, 0 wrong · 4 to mark');

    await user.keyboard('2');
    await user.keyboard('{ArrowUp}');
    expect(rightButton(1)).toHaveFocus();
    await user.keyboard('{ArrowDown}1');
    expect(rightButton(2)).toHaveAttribute('aria-pressed', 'true');
    expect(screen.queryByRole('textbox')).toBeNull();
    expect(score()).toHaveTextContent('1 right, 0 wrong · 3 to mark');
  });

  it('works by tapping too, and marks the rest right in one go', async () => {
    const { onSave, user } = renderGrid();
    await user.click(wrongButton(3));
    expect(screen.getByRole('textbox', { name: 'What the child wrote for item 3' })).toHaveFocus();
    await user.keyboard('88');
    await user.click(screen.getByRole('button', { name: 'Mark the rest right' }));
    expect(score()).toHaveTextContent('3 right, 1 wrong · all marked');
    expect(screen.queryByRole('button', { name: 'Mark the rest right' })).toBeNull();
    await user.click(screen.getByRole('button', { name: 'Save marks' }));
    expect(onSave.mock.calls[0]?.[0]).toEqual([
      { keyItemId: 11, correct: true, answer: null },
      { keyItemId: 12, correct: true, answer: null },
      { keyItemId: 13, correct: false, answer: '88' },
      { keyItemId: 14, correct: true, answer: null },
    ]);
  });

  it('starts from the saved marks and leaves unmarked items out of the save', async () => {
    const onSave = vi.fn();
    render(
      <MarkingGrid
        items={items}
        saved={[
          { id: 1, keyItemId: 12, number: 2, correct: false, answer: '139', missId: 40 },
          { id: 2, keyItemId: 11, number: 1, correct: true, answer: null, missId: null },
        ]}
        saving={false}
        onSave={onSave}
      />,
    );
    expect(within(screen.getByTestId('mark-row-2')).getByRole('textbox')).toHaveValue('139');
    expect(score()).toHaveTextContent('1 right, 1 wrong · 2 to mark');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Save marks' }));
    expect(onSave).toHaveBeenCalledWith([
      { keyItemId: 11, correct: true, answer: null },
      { keyItemId: 12, correct: false, answer: '139' },
    ]);
  });

  it('cannot save before anything is marked', () => {
    renderGrid();
    expect(screen.getByRole('button', { name: 'Save marks' })).toBeDisabled();
  });
});

describe('MarkingGrid with a flagged key answer', () => {
  // The key says 239 for 304 − 75; the checker works out 229 (DESIGN.md's catalog example).
  const flagged: MarkableItem[] = [
    {
      id: 21,
      number: 1,
      prompt: '304 - 75',
      answer: '239',
      revisitLessons: [],
      facts: [],
      check: { status: 'disagrees', expected: '229', message: 'item 1: the key says 239' },
    },
    { id: 22, number: 2, prompt: '58 + 67', answer: '125', revisitLessons: [], facts: [] },
  ];

  it('says so on that item, and makes a miss only when the parent says the key is right', async () => {
    const onSave = vi.fn();
    render(<MarkingGrid items={flagged} saved={[]} saving={false} onSave={onSave} />);
    const user = userEvent.setup();
    const row = screen.getByTestId('mark-row-1');
    expect(within(row).getByRole('note')).toHaveTextContent(
      'The checker works this out as 229: check the key. No miss is made from this item until you say which answer is right.',
    );
    expect(within(screen.getByTestId('mark-row-2')).queryByRole('note')).toBeNull();
    await user.click(wrongButton(1));
    await user.keyboard('229');
    await user.click(screen.getByRole('button', { name: 'Save marks' }));
    expect(onSave).toHaveBeenLastCalledWith([{ keyItemId: 21, correct: false, answer: '229' }]);
    await user.click(
      within(row).getByRole('checkbox', { name: 'The key’s 239 is right: make a miss' }),
    );
    await user.click(screen.getByRole('button', { name: 'Save marks' }));
    expect(onSave).toHaveBeenLastCalledWith([
      { keyItemId: 21, correct: false, answer: '229', keyAnswerRight: true },
    ]);
  });
});

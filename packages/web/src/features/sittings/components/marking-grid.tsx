import { Button, Checkbox, InputGroup, Intent } from '@blueprintjs/core';
import { CrossIcon, TickIcon } from '@blueprintjs/icons';
import { useEffect, useRef, useState, type KeyboardEvent } from 'react';

import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { keyFlagged, type MarkableItem, type MarkInput, type SittingMark } from '../types';

type Mark = { correct: boolean | null; answer: string; keyAnswerRight?: boolean };

const RIGHT_KEYS = new Set(['1', 'r', 'R']);
const WRONG_KEYS = new Set(['2', 'w', 'W']);

function initialMarks(items: readonly MarkableItem[], saved: readonly SittingMark[]) {
  const byItem = new Map(saved.map((m) => [m.keyItemId, m]));
  return Object.fromEntries(
    items.map((item) => {
      const mark = byItem.get(item.id);
      return [item.id, { correct: mark ? mark.correct : null, answer: mark?.answer ?? '' }];
    }),
  ) as Record<number, Mark>;
}

/**
 * Marks a sitting item by item, fast: `1` (or R) right, `2` (or W) wrong, arrows move. A wrong
 * item opens a box for the child's answer; Enter there goes on to the next item. Taps work the
 * same on a phone. The running score is announced politely as it changes.
 */
export function MarkingGrid({
  items,
  saved,
  saving,
  onSave,
  answerKeyId,
}: {
  items: readonly MarkableItem[];
  saved: readonly SittingMark[];
  saving: boolean;
  onSave: (marks: MarkInput[]) => void;
  /** For the link to check a flagged key answer. */
  answerKeyId?: number;
}) {
  const [marks, setMarks] = useState(() => initialMarks(items, saved));
  const rowButtons = useRef<(HTMLButtonElement | null)[]>([]);
  const answerInputs = useRef<(HTMLInputElement | null)[]>([]);
  // A wrong mark opens the answer box; it exists only after the next render, so focus it then.
  const answerToFocus = useRef<number | null>(null);

  useEffect(() => {
    if (answerToFocus.current === null) return;
    answerInputs.current[answerToFocus.current]?.focus();
    answerToFocus.current = null;
  });

  const list = items.map((item) => ({
    item,
    mark: marks[item.id] ?? { correct: null, answer: '' },
  }));
  const right = list.filter((r) => r.mark.correct === true).length;
  const wrong = list.filter((r) => r.mark.correct === false).length;
  const left = items.length - right - wrong;

  const setMark = (id: number, change: Partial<Mark>) =>
    setMarks((current) => ({
      ...current,
      [id]: { ...(current[id] ?? { correct: null, answer: '' }), ...change },
    }));

  const move = (index: number) => {
    if (index < 0 || index >= items.length) return;
    rowButtons.current[index]?.focus();
  };

  const markRight = (index: number) => {
    const item = items[index];
    if (!item) return;
    setMark(item.id, { correct: true });
    if (index + 1 < items.length) move(index + 1);
  };

  const markWrong = (index: number) => {
    const item = items[index];
    if (!item) return;
    answerToFocus.current = index;
    setMark(item.id, { correct: false });
  };

  const onRowKeyDown = (index: number) => (event: KeyboardEvent) => {
    if (event.altKey || event.ctrlKey || event.metaKey) return;
    if (RIGHT_KEYS.has(event.key)) markRight(index);
    else if (WRONG_KEYS.has(event.key)) markWrong(index);
    else if (event.key === 'ArrowDown' || event.key === 'j') move(index + 1);
    else if (event.key === 'ArrowUp' || event.key === 'k') move(index - 1);
    else return;
    event.preventDefault();
  };

  // Enter moves on when it is released, so the key press cannot also reach the next row's button.
  const onAnswerKeyDown = (event: KeyboardEvent) => {
    if (event.key === 'Enter' || event.key === 'ArrowDown' || event.key === 'ArrowUp') {
      event.preventDefault();
    }
  };

  const onAnswerKeyUp = (index: number) => (event: KeyboardEvent) => {
    if (event.key === 'Enter' || event.key === 'ArrowDown') move(index + 1);
    else if (event.key === 'ArrowUp') move(index - 1);
    else if (event.key === 'Escape') move(index);
  };

  const markRestRight = () =>
    setMarks((current) =>
      Object.fromEntries(
        items.map((item) => {
          const mark = current[item.id] ?? { correct: null, answer: '' };
          return [item.id, mark.correct === null ? { ...mark, correct: true } : mark];
        }),
      ),
    );

  const save = () =>
    onSave(
      list.flatMap(({ item, mark }) =>
        mark.correct === null
          ? []
          : [
              {
                keyItemId: item.id,
                correct: mark.correct,
                answer: mark.correct ? null : mark.answer.trim() || null,
                ...(!mark.correct && keyFlagged(item) && mark.keyAnswerRight
                  ? { keyAnswerRight: true }
                  : {}),
              },
            ],
      ),
    );

  return (
    <div className="wb-marking">
      <p className="wb-muted wb-marking-help" id="marking-help">
        Press <kbd>1</kbd> for right and <kbd>2</kbd> for wrong (or tap); <kbd>↑</kbd> <kbd>↓</kbd>{' '}
        move. For a wrong item, type what the child wrote and press <kbd>Enter</kbd>.
      </p>
      <table
        className="wb-rtable wb-marking-table"
        aria-label="Marks"
        aria-describedby="marking-help"
      >
        <thead>
          <tr>
            <th scope="col">No.</th>
            <th scope="col">Problem</th>
            <th scope="col">Key</th>
            <th scope="col">Mark</th>
            <th scope="col">Child’s answer</th>
          </tr>
        </thead>
        <tbody>
          {list.map(({ item, mark }, index) => {
            const state = mark.correct === null ? 'open' : mark.correct ? 'right' : 'wrong';
            return (
              <tr
                key={item.id}
                className={`wb-mark-row wb-mark-${state}${keyFlagged(item) ? ' wb-mark-flagged' : ''}`}
                data-testid={`mark-row-${item.number}`}
              >
                <td data-label="No." className="wb-cell-strong wb-mark-number">
                  {item.number}
                </td>
                <td data-label="Problem" className="wb-digits wb-mark-prompt">
                  {item.prompt}
                </td>
                <td data-label="Key" className="wb-digits wb-mark-key">
                  {item.answer}
                  {keyFlagged(item) ? (
                    <span className="wb-key-flag" role="note">
                      The checker works this out as{' '}
                      <span className="wb-digits">{item.check?.expected}</span>: check the key. No
                      miss is made from this item until you say which answer is right.
                    </span>
                  ) : null}
                </td>
                <td data-label="Mark" className="wb-mark-buttons">
                  <Button
                    ref={(element) => {
                      rowButtons.current[index] = element;
                    }}
                    icon={<TickIcon />}
                    variant={state === 'right' ? 'solid' : 'outlined'}
                    intent={state === 'right' ? Intent.PRIMARY : Intent.NONE}
                    aria-pressed={state === 'right'}
                    aria-label={`Item ${item.number} right`}
                    onClick={() => markRight(index)}
                    onKeyDown={onRowKeyDown(index)}
                  >
                    Right
                  </Button>
                  <Button
                    icon={<CrossIcon />}
                    variant="outlined"
                    className={state === 'wrong' ? 'wb-mark-wrong-on' : undefined}
                    aria-pressed={state === 'wrong'}
                    aria-label={`Item ${item.number} wrong`}
                    onClick={() => markWrong(index)}
                    onKeyDown={onRowKeyDown(index)}
                  >
                    Wrong
                  </Button>
                </td>
                <td data-label="Child’s answer" className="wb-mark-answer">
                  {state === 'wrong' ? (
                    <InputGroup
                      inputRef={(element) => {
                        answerInputs.current[index] = element;
                      }}
                      value={mark.answer}
                      onChange={(event) => setMark(item.id, { answer: event.currentTarget.value })}
                      onKeyDown={onAnswerKeyDown}
                      onKeyUp={onAnswerKeyUp(index)}
                      className="wb-digits"
                      autoComplete="off"
                      aria-label={`What the child wrote for item ${item.number}`}
                      placeholder="What they wrote"
                    />
                  ) : null}
                  {state === 'wrong' && keyFlagged(item) ? (
                    <div className="wb-key-choice">
                      <Checkbox
                        checked={mark.keyAnswerRight === true}
                        onChange={(e) =>
                          setMark(item.id, { keyAnswerRight: e.currentTarget.checked })
                        }
                        label={`The key’s ${item.answer} is right: make a miss`}
                      />
                      {answerKeyId !== undefined ? (
                        <Link to={paths.app.answerKey.getHref(answerKeyId)}>
                          Or fix the key’s answer
                        </Link>
                      ) : null}
                    </div>
                  ) : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <div className="wb-marking-bar">
        <p className="wb-marking-score" role="status" aria-live="polite">
          <strong>
            {right} right, {wrong} wrong
          </strong>
          {left > 0 ? ` · ${left} to mark` : ' · all marked'}
        </p>
        <div className="wb-actions">
          {left > 0 ? (
            <Button variant="outlined" onClick={markRestRight}>
              Mark the rest right
            </Button>
          ) : null}
          <Button
            intent={Intent.PRIMARY}
            size="large"
            loading={saving}
            disabled={right + wrong === 0}
            onClick={save}
          >
            Save marks
          </Button>
        </div>
      </div>
    </div>
  );
}

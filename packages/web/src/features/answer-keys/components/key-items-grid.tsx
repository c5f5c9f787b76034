import { Button, InputGroup, Intent } from '@blueprintjs/core';
import { PlusIcon, TrashIcon } from '@blueprintjs/icons';
import type { KeyboardEvent } from 'react';
import {
  useFieldArray,
  useWatch,
  type Control,
  type FieldErrors,
  type UseFormRegister,
  type UseFormSetFocus,
} from 'react-hook-form';

import { checkItem } from '../utils/check-item';
import { revisitProblem } from '../utils/lists';

/** One item as the grid holds it: text in every cell, lists as `a; b`. */
export type ItemRow = {
  id?: number;
  number: string;
  prompt: string;
  answer: string;
  skills: string;
  revisit: string;
  facts: string;
};

export type ItemsValues = { items: ItemRow[]; reason: string };

type Column = {
  field: Exclude<keyof ItemRow, 'id'>;
  label: string;
  mono?: boolean;
  inputMode?: 'numeric' | 'text';
};

const COLUMNS: readonly Column[] = [
  { field: 'number', label: 'No.', inputMode: 'numeric' },
  { field: 'prompt', label: 'Problem', mono: true },
  { field: 'answer', label: 'Answer', mono: true },
  { field: 'skills', label: 'Skills' },
  { field: 'revisit', label: 'Lessons to revisit' },
  { field: 'facts', label: 'Fact family' },
];

export const blankRow = (number: number): ItemRow => ({
  number: String(number),
  prompt: '',
  answer: '',
  skills: '',
  revisit: '',
  facts: '',
});

const RULES = {
  number: {
    validate: (value: string, values: ItemsValues) => {
      if (!/^\d{1,3}$/.test(value.trim()) || Number(value) < 1) return 'A number from 1 to 999.';
      const same = values.items.filter((row) => Number(row.number) === Number(value)).length;
      return same < 2 || `Number ${Number(value)} is used twice.`;
    },
  },
  prompt: {
    validate: (value: string) => value.trim().length > 0 || 'Type the problem as printed.',
    maxLength: { value: 200, message: 'At most 200 characters.' },
  },
  answer: {
    validate: (value: string) => value.trim().length > 0 || 'Type the key’s answer.',
    maxLength: { value: 80, message: 'At most 80 characters.' },
  },
  revisit: { validate: (value: string) => revisitProblem(value) ?? true },
  skills: {},
  facts: {},
};

/**
 * The items of a key as an editable table, built for typing a printed key in fast: Tab moves
 * across, Enter goes down a row and on the last row adds the next item. The checker's flag
 * shows under any item whose answer disagrees with the worked-out problem.
 */
export function KeyItemsGrid({
  control,
  register,
  errors,
  setFocus,
}: {
  control: Control<ItemsValues>;
  register: UseFormRegister<ItemsValues>;
  errors: FieldErrors<ItemsValues>;
  setFocus: UseFormSetFocus<ItemsValues>;
}) {
  const { fields, append, remove } = useFieldArray({ control, name: 'items', keyName: 'rowKey' });
  const rows = useWatch({ control, name: 'items' }) ?? [];

  const nextNumber = () => rows.reduce((max, row) => Math.max(max, Number(row.number) || 0), 0) + 1;

  const addRow = () => {
    append(blankRow(nextNumber()), { focusName: `items.${fields.length}.prompt` });
  };

  const onKeyDown = (index: number, field: Column['field']) => (event: KeyboardEvent) => {
    if (event.key !== 'Enter' || event.nativeEvent.isComposing) return;
    event.preventDefault();
    if (index === fields.length - 1) addRow();
    else setFocus(`items.${index + 1}.${field}`);
  };

  return (
    <div className="wb-rtable-wrap">
      <table className="wb-rtable wb-items-grid" aria-label="Items of the key">
        <thead>
          <tr>
            {COLUMNS.map((column) => (
              <th key={column.field} scope="col" className={`wb-col-${column.field}`}>
                {column.label}
              </th>
            ))}
            <th scope="col">
              <span className="wb-visually-hidden">Remove</span>
            </th>
          </tr>
        </thead>
        {fields.map((row, index) => {
          const current = rows[index] ?? row;
          const check = checkItem(current.prompt, current.answer);
          const flagId = `item-${row.rowKey}-flag`;
          const flagged = check.status === 'disagrees' || check.status === 'unreadable-answer';
          const itemErrors = errors.items?.[index];
          const label = `item ${current.number || index + 1}`;
          return (
            <tbody key={row.rowKey} className={flagged ? 'wb-item wb-item-flagged' : 'wb-item'}>
              <tr>
                {COLUMNS.map((column) => {
                  const registration = register(
                    `items.${index}.${column.field}`,
                    RULES[column.field],
                  );
                  const error = itemErrors?.[column.field]?.message;
                  const errorId = `item-${row.rowKey}-${column.field}-error`;
                  const describedBy = [
                    error ? errorId : null,
                    column.field === 'answer' && flagged ? flagId : null,
                  ]
                    .filter(Boolean)
                    .join(' ');
                  return (
                    <td
                      key={column.field}
                      data-label={column.label}
                      className={`wb-col-${column.field}`}
                    >
                      <InputGroup
                        inputRef={registration.ref}
                        name={registration.name}
                        onChange={registration.onChange}
                        onBlur={registration.onBlur}
                        onKeyDown={onKeyDown(index, column.field)}
                        inputMode={column.inputMode}
                        autoComplete="off"
                        className={column.mono ? 'wb-digits' : undefined}
                        intent={error ? Intent.DANGER : Intent.NONE}
                        aria-label={`${column.label}, ${label}`}
                        aria-invalid={error ? true : undefined}
                        aria-describedby={describedBy || undefined}
                      />
                      {error ? (
                        <span id={errorId} className="wb-cell-error">
                          {error}
                        </span>
                      ) : null}
                    </td>
                  );
                })}
                <td className="wb-col-remove">
                  <Button
                    variant="minimal"
                    icon={<TrashIcon />}
                    aria-label={`Remove ${label}`}
                    onClick={() => remove(index)}
                  />
                </td>
              </tr>
              {flagged ? (
                <tr className="wb-item-flag-row">
                  <td colSpan={COLUMNS.length + 1}>
                    <span id={flagId} className="wb-flag">
                      Item {current.number}: {check.message}
                    </span>
                  </td>
                </tr>
              ) : null}
            </tbody>
          );
        })}
      </table>
      <Button icon={<PlusIcon />} variant="outlined" onClick={addRow} className="wb-add-row">
        Add an item
      </Button>
      <p className="wb-muted wb-grid-help">
        Press <kbd>Enter</kbd> to go down a row; on the last row it adds the next item. Separate
        skills and fact families (such as “sixes”) with <code>;</code>; write lessons to revisit as{' '}
        <code>12; 31-33</code>.
      </p>
    </div>
  );
}

import { Checkbox, Classes, FormGroup, Intent } from '@blueprintjs/core';
import type { ReactNode } from 'react';
import {
  useController,
  type FieldPath,
  type FieldValues,
  type UseControllerProps,
} from 'react-hook-form';

import { fieldIds } from './field-ids';

type CheckboxGroupFieldProps<T extends FieldValues, N extends FieldPath<T>> = UseControllerProps<
  T,
  N
> & {
  label: string;
  options: readonly { value: number; label: ReactNode }[];
  help?: ReactNode;
  idPrefix?: string;
};

/**
 * A list of ticks (which students a tutor may see, who gets an e-mail) kept as an array of ids in
 * react-hook-form; the error shows under the whole group.
 */
export function CheckboxGroupField<T extends FieldValues, N extends FieldPath<T>>({
  label,
  options,
  help,
  idPrefix,
  ...controller
}: CheckboxGroupFieldProps<T, N>) {
  const {
    field: { ref, name, value, onChange, onBlur, disabled },
    fieldState,
  } = useController(controller);
  const { id, describedBy } = fieldIds(name, idPrefix);
  const error = fieldState.error?.message;
  const below = error ?? help;
  const chosen = new Set<number>(Array.isArray(value) ? (value as number[]) : []);
  return (
    <FormGroup
      intent={error ? Intent.DANGER : Intent.NONE}
      helperText={below ? <span id={describedBy}>{below}</span> : undefined}
    >
      <fieldset
        className="wb-checkbox-group"
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={below ? describedBy : undefined}
      >
        <legend className={Classes.LABEL}>{label}</legend>
        {options.map((option, index) => (
          <Checkbox
            key={option.value}
            inputRef={index === 0 ? ref : undefined}
            name={name}
            checked={chosen.has(option.value)}
            disabled={disabled}
            onBlur={onBlur}
            labelElement={option.label}
            size="large"
            onChange={(event) => {
              const next = new Set(chosen);
              if (event.currentTarget.checked) next.add(option.value);
              else next.delete(option.value);
              onChange(options.map((o) => o.value).filter((v) => next.has(v)));
            }}
          />
        ))}
      </fieldset>
    </FormGroup>
  );
}

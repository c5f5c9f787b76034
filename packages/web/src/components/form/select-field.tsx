import { FormGroup, HTMLSelect, Intent } from '@blueprintjs/core';
import type { ReactNode } from 'react';
import { useController, type FieldValues, type UseControllerProps } from 'react-hook-form';

import { fieldIds } from './field-ids';

type SelectFieldProps<T extends FieldValues> = UseControllerProps<T> & {
  label: string;
  options: readonly { value: string; label: string }[];
  help?: ReactNode;
  idPrefix?: string;
};

/**
 * A labelled native select (easy on phones) wired to react-hook-form. Controlled, so the form's
 * value and the shown option can never disagree.
 */
export function SelectField<T extends FieldValues>({
  label,
  options,
  help,
  idPrefix,
  ...controller
}: SelectFieldProps<T>) {
  const {
    field: { ref, name, value, onChange, onBlur, disabled },
    fieldState,
  } = useController(controller);
  const { id, describedBy } = fieldIds(name, idPrefix);
  const error = fieldState.error?.message;
  const below = error ?? help;
  return (
    <FormGroup
      label={label}
      labelFor={id}
      intent={error ? Intent.DANGER : Intent.NONE}
      helperText={below ? <span id={describedBy}>{below}</span> : undefined}
    >
      <HTMLSelect
        id={id}
        ref={ref}
        name={name}
        value={value as string}
        onChange={(event) => onChange(event.currentTarget.value)}
        onBlur={onBlur}
        disabled={disabled}
        fill
        large
        aria-invalid={error ? true : undefined}
        aria-describedby={below ? describedBy : undefined}
        options={options.map((option) => ({ value: option.value, label: option.label }))}
      />
    </FormGroup>
  );
}

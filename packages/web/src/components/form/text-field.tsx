import { FormGroup, InputGroup, Intent, type InputGroupProps } from '@blueprintjs/core';
import type { ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

import { fieldIds } from './field-ids';

type TextFieldProps = {
  label: string;
  registration: UseFormRegisterReturn;
  error?: string | undefined;
  help?: ReactNode;
  idPrefix?: string;
} & Pick<InputGroupProps, 'type' | 'autoComplete' | 'placeholder' | 'autoFocus' | 'inputMode'>;

/** A labelled Blueprint input wired to react-hook-form; its error shows right under it. */
export function TextField({
  label,
  registration,
  error,
  help,
  idPrefix,
  ...input
}: TextFieldProps) {
  const { ref, ...field } = registration;
  const { id, describedBy } = fieldIds(field.name, idPrefix);
  const below = error ?? help;
  return (
    <FormGroup
      label={label}
      labelFor={id}
      intent={error ? Intent.DANGER : Intent.NONE}
      helperText={below ? <span id={describedBy}>{below}</span> : undefined}
    >
      <InputGroup
        id={id}
        inputRef={ref}
        {...field}
        {...input}
        size="large"
        intent={error ? Intent.DANGER : Intent.NONE}
        aria-invalid={error ? true : undefined}
        aria-describedby={below ? describedBy : undefined}
      />
    </FormGroup>
  );
}

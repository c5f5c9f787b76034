import { FormGroup, Intent, TextArea } from '@blueprintjs/core';
import type { ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

import { fieldIds } from './field-ids';

type TextAreaFieldProps = {
  label: string;
  registration: UseFormRegisterReturn;
  error?: string | undefined;
  help?: ReactNode;
  idPrefix?: string;
  rows?: number;
  placeholder?: string;
};

/** A labelled Blueprint text area wired to react-hook-form; its error shows right under it. */
export function TextAreaField({
  label,
  registration,
  error,
  help,
  idPrefix,
  rows = 4,
  placeholder,
}: TextAreaFieldProps) {
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
      <TextArea
        id={id}
        inputRef={ref}
        {...field}
        rows={rows}
        placeholder={placeholder}
        fill
        size="large"
        intent={error ? Intent.DANGER : Intent.NONE}
        aria-invalid={error ? true : undefined}
        aria-describedby={below ? describedBy : undefined}
      />
    </FormGroup>
  );
}

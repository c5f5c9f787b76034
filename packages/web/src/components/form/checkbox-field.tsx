import { Checkbox, FormGroup, Intent } from '@blueprintjs/core';
import type { ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

import { fieldIds } from './field-ids';

type CheckboxFieldProps = {
  label: ReactNode;
  registration: UseFormRegisterReturn;
  error?: string | undefined;
  idPrefix?: string;
};

/** A Blueprint checkbox wired to react-hook-form (the field ref goes through `inputRef`). */
export function CheckboxField({ label, registration, error, idPrefix }: CheckboxFieldProps) {
  const { ref, ...field } = registration;
  const { id, describedBy } = fieldIds(field.name, idPrefix);
  return (
    <FormGroup
      intent={error ? Intent.DANGER : Intent.NONE}
      helperText={error ? <span id={describedBy}>{error}</span> : undefined}
    >
      <Checkbox
        id={id}
        inputRef={ref}
        {...field}
        size="large"
        labelElement={label}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? describedBy : undefined}
      />
    </FormGroup>
  );
}

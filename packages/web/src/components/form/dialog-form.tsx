import { Button, DialogBody, DialogFooter, Intent } from '@blueprintjs/core';
import type { FormEventHandler, ReactNode } from 'react';

import { FormError } from './form-error';

/**
 * The form inside a dialog: the form-wide error, the fields, then Cancel and the submit button —
 * `<DialogForm label="Add a course" submitText="Add course" …>{fields}</DialogForm>`.
 */
export function DialogForm({
  label,
  onSubmit,
  error,
  onCancel,
  submitText,
  submitting,
  submitDisabled,
  children,
}: {
  /** Names the form for screen readers. */
  label: string;
  onSubmit: FormEventHandler<HTMLFormElement>;
  error: string | null;
  onCancel: () => void;
  submitText: string;
  submitting: boolean;
  /** Holds the submit back while the form knows it would be refused. */
  submitDisabled?: boolean;
  children: ReactNode;
}) {
  return (
    <form onSubmit={onSubmit} noValidate aria-label={label}>
      <DialogBody>
        <FormError message={error} />
        {children}
      </DialogBody>
      <DialogFooter
        actions={
          <>
            <Button variant="minimal" onClick={onCancel}>
              Cancel
            </Button>
            <Button
              type="submit"
              intent={Intent.PRIMARY}
              loading={submitting}
              disabled={submitDisabled}
            >
              {submitText}
            </Button>
          </>
        }
      />
    </form>
  );
}

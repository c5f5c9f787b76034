import { Alert, Callout, Intent } from '@blueprintjs/core';
import { TrashIcon } from '@blueprintjs/icons';
import { useId, useState, type ReactNode } from 'react';

import { isApiError } from '../lib/api-client';

type ConfirmDeleteAlertProps = {
  isOpen: boolean;
  /** What the parent is asked, e.g. “Delete lesson 12?”. */
  children: ReactNode;
  /** Deletes; a refusal (such as a 409 naming what still uses it) stays on screen. */
  onConfirm: () => Promise<unknown>;
  onDeleted: () => void;
  onClose: () => void;
};

/**
 * Asks before deleting. When the API refuses (a lesson still used by a key answers 409 with what
 * uses it), its message is shown right in the alert, so the parent knows what to change first.
 */
export function ConfirmDeleteAlert({
  isOpen,
  children,
  onConfirm,
  onDeleted,
  onClose,
}: ConfirmDeleteAlertProps) {
  const [refusal, setRefusal] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const questionId = useId();
  const close = () => {
    setRefusal(null);
    onClose();
  };
  return (
    <Alert
      isOpen={isOpen}
      aria-labelledby={questionId}
      intent={refusal ? Intent.NONE : Intent.DANGER}
      icon={<TrashIcon />}
      cancelButtonText={refusal ? undefined : 'Keep'}
      confirmButtonText={refusal ? 'Close' : 'Delete'}
      loading={pending}
      onCancel={close}
      onConfirm={() => {
        if (refusal) {
          close();
          return;
        }
        setPending(true);
        onConfirm().then(
          () => {
            setPending(false);
            setRefusal(null);
            onDeleted();
          },
          (error: unknown) => {
            setPending(false);
            setRefusal(
              isApiError(error) ? error.message : 'It could not be deleted. Please try again.',
            );
          },
        );
      }}
    >
      <div id={questionId}>{children}</div>
      {refusal ? (
        <Callout intent={Intent.WARNING} role="alert" className="wb-form-error" title="Not deleted">
          {refusal}
        </Callout>
      ) : null}
    </Alert>
  );
}

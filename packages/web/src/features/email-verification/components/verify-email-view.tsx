import { Button, Callout, Intent } from '@blueprintjs/core';
import { TickCircleIcon } from '@blueprintjs/icons';
import type { ReactNode } from 'react';

import { FormError } from '../../../components/form/form-error';
import { isApiError } from '../../../lib/api-client';
import { useConfirmEmailVerification } from '../api/confirm-email-verification';

/**
 * The page the e-mailed link opens. Confirming waits for a press, so a mail program that
 * opens links to look at them does not use the link up.
 */
export function VerifyEmailView({ token, next }: { token: string; next: ReactNode }) {
  const confirm = useConfirmEmailVerification();
  if (confirm.isSuccess) {
    return (
      <>
        <Callout
          icon={<TickCircleIcon />}
          intent={Intent.SUCCESS}
          className="wb-callout"
          role="status"
        >
          {confirm.data.message}
        </Callout>
        <p>{next}</p>
      </>
    );
  }
  const dead = isApiError(confirm.error, 404) || isApiError(confirm.error, 410);
  return (
    <>
      <FormError
        message={
          confirm.isError
            ? isApiError(confirm.error)
              ? confirm.error.message
              : 'Confirming did not work just now. Please try again.'
            : null
        }
      />
      {dead ? (
        <p className="wb-muted">
          Sign in and press “Send a new link” at the top of any page to get a fresh one.
        </p>
      ) : null}
      <Button
        intent={Intent.PRIMARY}
        size="large"
        fill
        loading={confirm.isPending}
        onClick={() => confirm.mutate(token)}
      >
        Confirm my address
      </Button>
    </>
  );
}

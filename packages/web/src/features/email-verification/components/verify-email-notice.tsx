import { Button, Callout, Intent } from '@blueprintjs/core';
import { EnvelopeIcon } from '@blueprintjs/icons';
import { useState } from 'react';

import { isApiError } from '../../../lib/api-client';
import { useResendEmailVerification } from '../api/resend-email-verification';

/** Shown on every signed-in page until the account's address is confirmed. */
export function VerifyEmailNotice({ email }: { email: string }) {
  const resend = useResendEmailVerification();
  const [answer, setAnswer] = useState<string | null>(null);
  return (
    <Callout
      icon={<EnvelopeIcon />}
      className="wb-callout wb-verify-notice"
      title="Please confirm your e-mail address"
    >
      <p>
        We sent a link to <strong>{email}</strong>. Open it to confirm the address is yours; until
        then you cannot invite anyone to your household.
      </p>
      {answer ? (
        <p role="status">{answer}</p>
      ) : (
        <Button
          variant="outlined"
          intent={Intent.PRIMARY}
          loading={resend.isPending}
          onClick={() =>
            resend.mutate(undefined, {
              onSuccess: (res) => setAnswer(res.message),
              onError: (error) =>
                setAnswer(
                  isApiError(error)
                    ? error.message
                    : 'The link could not be sent just now. Please try again later.',
                ),
            })
          }
        >
          Send a new link
        </Button>
      )}
    </Callout>
  );
}

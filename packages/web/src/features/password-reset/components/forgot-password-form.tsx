import { Button, Callout, Intent } from '@blueprintjs/core';
import { EnvelopeIcon } from '@blueprintjs/icons';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextField } from '../../../components/form/text-field';
import { useRequestPasswordReset } from '../api/request-password-reset';

/** Asks for a link to set a new password; the answer never says whether the address is known. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<{ email: string }>({ defaultValues: { email: '' } });

  const onSubmit = handleSubmit(async ({ email }) => {
    setFormError(null);
    try {
      const answer = await request.mutateAsync(email.trim());
      setSent(answer.message);
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, ['email']));
    }
  });

  if (sent) {
    return (
      <Callout icon={<EnvelopeIcon />} className="wb-callout wb-reset-sent" role="status">
        {sent} Check your inbox (and the spam folder).
      </Callout>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Ask for a new password">
      <FormError message={formError} />
      <TextField
        idPrefix="forgot"
        label="E-mail"
        type="email"
        inputMode="email"
        autoComplete="username"
        autoFocus
        help="The address you sign in with. We e-mail it a link to set a new password."
        registration={register('email', {
          required: 'Enter the e-mail you signed up with.',
          pattern: {
            value: /^\S+@\S+\.\S+$/,
            message: 'That does not look like an e-mail address.',
          },
        })}
        error={errors.email?.message}
      />
      <Button type="submit" intent={Intent.PRIMARY} size="large" fill loading={request.isPending}>
        E-mail me a link
      </Button>
    </form>
  );
}

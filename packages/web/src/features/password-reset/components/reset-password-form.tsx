import { Button, Intent } from '@blueprintjs/core';
import { useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextField } from '../../../components/form/text-field';
import { isApiError } from '../../../lib/api-client';
import { useConfirmPasswordReset } from '../api/confirm-password-reset';

type ResetValues = { password: string; repeat: string };

const PASSWORD_MIN = 8;
const PASSWORD_MAX = 128;

/** Sets a new password from the e-mailed link; a used or expired link says so plainly. */
export function ResetPasswordForm({
  token,
  onDone,
  requestAgain,
}: {
  token: string;
  onDone: (message: string) => void;
  /** Where to ask for a fresh link when this one no longer works. */
  requestAgain: ReactNode;
}) {
  const confirm = useConfirmPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const [linkDead, setLinkDead] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    getValues,
    formState: { errors },
  } = useForm<ResetValues>({ defaultValues: { password: '', repeat: '' } });

  const onSubmit = handleSubmit(async ({ password }) => {
    setFormError(null);
    try {
      const answer = await confirm.mutateAsync({ token, password });
      onDone(answer.message);
    } catch (error) {
      if (isApiError(error, 404) || isApiError(error, 410)) setLinkDead(true);
      setFormError(applyFieldErrors(error, setError, ['password']));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Set a new password">
      <FormError message={formError} />
      {linkDead ? <p className="wb-reset-again">{requestAgain}</p> : null}
      <TextField
        idPrefix="reset"
        label="New password"
        type="password"
        autoComplete="new-password"
        autoFocus
        help={`${PASSWORD_MIN} to ${PASSWORD_MAX} characters. A few words strung together works well.`}
        registration={register('password', {
          required: 'Choose a new password.',
          minLength: { value: PASSWORD_MIN, message: `Use at least ${PASSWORD_MIN} characters.` },
          maxLength: { value: PASSWORD_MAX, message: `Use at most ${PASSWORD_MAX} characters.` },
        })}
        error={errors.password?.message}
      />
      <TextField
        idPrefix="reset"
        label="The new password again"
        type="password"
        autoComplete="new-password"
        registration={register('repeat', {
          required: 'Type the new password once more.',
          validate: (value) =>
            value === getValues('password') || 'The two passwords are not the same.',
        })}
        error={errors.repeat?.message}
      />
      <Button type="submit" intent={Intent.PRIMARY} size="large" fill loading={confirm.isPending}>
        Set new password
      </Button>
    </form>
  );
}

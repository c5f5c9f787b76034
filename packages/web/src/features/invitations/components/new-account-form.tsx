import { Button, Intent } from '@blueprintjs/core';
import { useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';

import { AccountFields } from '../../../components/form/account-fields';
import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextField } from '../../../components/form/text-field';
import { isApiError } from '../../../lib/api-client';
import type { Me } from '../../../lib/auth';
import { useAcceptInvitation } from '../api/accept-invitation';

type NewAccountValues = {
  displayName: string;
  email: string;
  password: string;
  adultConfirmed: boolean;
};

const FIELDS = ['displayName', 'email', 'password'] as const;

/** A new person accepts: their name and a password make the account, and it joins at once. */
export function NewAccountForm({
  token,
  invitedEmail,
  householdName,
  caution,
  onJoined,
}: {
  token: string;
  invitedEmail: string;
  householdName: string;
  /** What we promise about children's data, said before anyone signs up. */
  caution: ReactNode;
  onJoined: (me: Me) => void;
}) {
  const accept = useAcceptInvitation();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<NewAccountValues>({
    defaultValues: { displayName: '', email: invitedEmail, password: '', adultConfirmed: false },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const email = values.email.trim();
    try {
      onJoined(
        await accept.mutateAsync({
          token,
          displayName: values.displayName.trim(),
          password: values.password,
          ...(email.toLowerCase() === invitedEmail.toLowerCase() ? {} : { email }),
        }),
      );
    } catch (error) {
      // The answer for an e-mail that needs a sign-in never says whether it has an account.
      if (isApiError(error, 401) && error.fields.email) {
        setError('email', {
          type: 'server',
          message: 'To join with this e-mail, sign in first (below), then join; or use another.',
        });
        return;
      }
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create an account and join">
      <FormError message={formError} />
      <TextField
        idPrefix="join"
        label="Your name"
        help={`Shown to the people in ${householdName}.`}
        autoComplete="name"
        registration={register('displayName', {
          required: 'Tell us what to call you.',
          validate: (value) => value.trim().length > 0 || 'Tell us what to call you.',
          maxLength: { value: 80, message: 'Keep it under 80 characters.' },
        })}
        error={errors.displayName?.message}
      />
      <AccountFields
        register={register}
        errors={errors}
        idPrefix="join"
        emailHelp="The address the invitation went to; change it if you prefer another."
        caution={caution}
        adult={{
          label: 'I am an adult, helping this family with their children’s math.',
          required: 'Workback accounts are for adults only. Tick the box to go on.',
        }}
      />
      <Button type="submit" intent={Intent.PRIMARY} size="large" fill loading={accept.isPending}>
        Create account and join
      </Button>
    </form>
  );
}

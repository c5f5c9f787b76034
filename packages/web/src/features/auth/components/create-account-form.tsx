import { Button, Intent } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { AccountFields } from '../../../components/form/account-fields';
import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextField } from '../../../components/form/text-field';
import { isApiError } from '../../../lib/api-client';
import { useCreateAccount, type Me } from '../../../lib/auth';
import { PrivacyCaution } from './privacy-caution';

type CreateAccountValues = {
  householdName: string;
  displayName: string;
  email: string;
  password: string;
  adultConfirmed: boolean;
};

const FIELDS = ['householdName', 'displayName', 'email', 'password', 'adultConfirmed'] as const;

export function CreateAccountForm({ onCreated }: { onCreated: (me: Me) => void }) {
  const createAccount = useCreateAccount();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<CreateAccountValues>({
    defaultValues: {
      householdName: '',
      displayName: '',
      email: '',
      password: '',
      adultConfirmed: false,
    },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const me = await createAccount.mutateAsync({
        householdName: values.householdName.trim(),
        displayName: values.displayName.trim(),
        email: values.email.trim(),
        password: values.password,
        adultConfirmed: true,
      });
      onCreated(me);
    } catch (error) {
      if (isApiError(error, 409)) {
        setError('email', {
          type: 'server',
          message: 'An account with this e-mail already exists. Sign in instead.',
        });
        return;
      }
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  const required = (message: string) => ({
    required: message,
    validate: (value: string) => value.trim().length > 0 || message,
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create account">
      <FormError message={formError} />
      <TextField
        label="Household name"
        help="What your family calls itself here, such as “The Lakeside Learners”."
        autoComplete="organization"
        registration={register('householdName', {
          ...required('Give your household a name.'),
          maxLength: { value: 100, message: 'Keep it under 100 characters.' },
        })}
        error={errors.householdName?.message}
      />
      <TextField
        label="Your name"
        help="Shown to the people you invite to help."
        autoComplete="name"
        registration={register('displayName', {
          ...required('Tell us what to call you.'),
          maxLength: { value: 100, message: 'Keep it under 100 characters.' },
        })}
        error={errors.displayName?.message}
      />
      <AccountFields
        register={register}
        errors={errors}
        caution={<PrivacyCaution />}
        adult={{
          label: 'I am an adult, and the parent or guardian of each child I add.',
          required: 'Only a parent or guardian can create a household. Tick the box to go on.',
        }}
      />
      <Button
        type="submit"
        intent={Intent.PRIMARY}
        size="large"
        fill
        loading={createAccount.isPending}
      >
        Create account
      </Button>
    </form>
  );
}

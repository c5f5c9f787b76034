import { Button, Intent } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextField } from '../../../components/form/text-field';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useSignIn, type Me, type SignInInput } from '../../../lib/auth';
import { DemoSignIns } from './demo-sign-ins';

const FIELDS = ['email', 'password'] as const;

export function SignInForm({ onSignedIn }: { onSignedIn: (me: Me) => void }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    formState: { errors },
  } = useForm<SignInInput>({ defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      onSignedIn(
        await signIn.mutateAsync({ email: values.email.trim(), password: values.password }),
      );
    } catch (error) {
      if (isApiError(error, 401)) {
        setFormError('That e-mail and password do not match an account. Check both and try again.');
        return;
      }
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <>
      <form onSubmit={onSubmit} noValidate aria-label="Sign in">
        <FormError message={formError} />
        <TextField
          label="E-mail"
          type="email"
          autoComplete="username"
          inputMode="email"
          registration={register('email', {
            required: 'Enter the e-mail you signed up with.',
            pattern: {
              value: /^\S+@\S+\.\S+$/,
              message: 'That does not look like an e-mail address.',
            },
          })}
          error={errors.email?.message}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          registration={register('password', { required: 'Enter your password.' })}
          error={errors.password?.message}
        />
        <p className="wb-forgot">
          <Link to={paths.forgotPassword.getHref()}>Forgot your password?</Link>
        </p>
        <Button type="submit" intent={Intent.PRIMARY} size="large" fill loading={signIn.isPending}>
          Sign in
        </Button>
      </form>
      <DemoSignIns
        onPick={(email, password) => {
          setValue('email', email, { shouldValidate: true });
          setValue('password', password, { shouldValidate: true });
        }}
      />
    </>
  );
}

import type { ReactNode } from 'react';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';

import { CheckboxField } from './checkbox-field';
import { TextField } from './text-field';

export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 128;

/** What every new account gives, whatever else its form asks first. */
export type AccountFieldValues = { email: string; password: string; adultConfirmed: boolean };

/**
 * The end of every sign-up: e-mail, password, what we promise about children's data, and the
 * adult's confirmation — `<AccountFields register={register} errors={errors} caution={…} adult={…} />`.
 */
export function AccountFields({
  register,
  errors,
  idPrefix,
  emailHelp,
  caution,
  adult,
}: {
  register: UseFormRegister<AccountFieldValues>;
  errors: FieldErrors<AccountFieldValues>;
  idPrefix?: string;
  emailHelp?: string;
  caution: ReactNode;
  /** Who may sign up here, and what to say when the box is left empty. */
  adult: { label: string; required: string };
}) {
  return (
    <>
      <TextField
        idPrefix={idPrefix}
        label="E-mail"
        type="email"
        inputMode="email"
        autoComplete="email"
        help={emailHelp}
        registration={register('email', {
          required: 'Enter your e-mail address.',
          pattern: {
            value: /^\S+@\S+\.\S+$/,
            message: 'That does not look like an e-mail address.',
          },
        })}
        error={errors.email?.message}
      />
      <TextField
        idPrefix={idPrefix}
        label="Password"
        type="password"
        autoComplete="new-password"
        help={`${PASSWORD_MIN} to ${PASSWORD_MAX} characters. A few words strung together works well.`}
        registration={register('password', {
          required: 'Choose a password.',
          minLength: { value: PASSWORD_MIN, message: `Use at least ${PASSWORD_MIN} characters.` },
          maxLength: { value: PASSWORD_MAX, message: `Use at most ${PASSWORD_MAX} characters.` },
        })}
        error={errors.password?.message}
      />
      {caution}
      <CheckboxField
        idPrefix={idPrefix}
        label={adult.label}
        registration={register('adultConfirmed', { required: adult.required })}
        error={errors.adultConfirmed?.message}
      />
    </>
  );
}

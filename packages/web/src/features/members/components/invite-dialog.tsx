import { Callout, Dialog, Intent } from '@blueprintjs/core';
import { Role } from '@workback/core';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { CheckboxGroupField } from '../../../components/form/checkbox-group-field';
import { DialogForm } from '../../../components/form/dialog-form';
import { SelectField } from '../../../components/form/select-field';
import { TextField } from '../../../components/form/text-field';
import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { useCreateInvitation } from '../api/create-invitation';
import type { StudentRef } from '../types';

type InviteValues = { email: string; role: string; studentIds: number[] };

const FIELDS = ['email', 'role', 'studentIds'] as const;

export const ROLE_CHOICES = {
  tutor: 'Tutor — sees only the children you tick, adds notes, builds review plans',
  parent: 'Parent — sees and changes everything in the household',
  owner: 'Owner — everything, including members and deleting the household',
} as const;

const INVITE_ROLES = [
  { value: Role.tutor, label: ROLE_CHOICES.tutor },
  { value: Role.parent, label: ROLE_CHOICES.parent },
];

function InviteForm({
  students,
  onClose,
}: {
  students: readonly StudentRef[];
  onClose: () => void;
}) {
  const toast = useToast();
  const invite = useCreateInvitation();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<InviteValues>({ defaultValues: { email: '', role: Role.tutor, studentIds: [] } });
  const role = useWatch({ control, name: 'role' });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const email = values.email.trim();
    try {
      await invite.mutateAsync({
        email,
        role: values.role as Role,
        studentIds: values.role === Role.tutor ? values.studentIds : [],
      });
      toast(`Invitation sent to ${email}. Its link works once, for 7 days.`);
      onClose();
    } catch (error) {
      if (isApiError(error, 409)) {
        setError('email', { type: 'server', message: error.message });
        return;
      }
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <DialogForm
      label="Invite someone"
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText="Send invitation"
      submitting={isSubmitting}
      submitDisabled={role === Role.tutor && students.length === 0}
    >
      <TextField
        idPrefix="invite"
        label="Their e-mail"
        type="email"
        inputMode="email"
        autoComplete="off"
        autoFocus
        help="We e-mail them a link to join. Nobody else sees the address."
        registration={register('email', {
          required: 'Enter the e-mail address to send the invitation to.',
          pattern: {
            value: /^\S+@\S+\.\S+$/,
            message: 'That does not look like an e-mail address.',
          },
        })}
        error={errors.email?.message}
      />
      <SelectField
        idPrefix="invite"
        label="They join as"
        options={INVITE_ROLES}
        control={control}
        name="role"
        rules={{ required: 'Choose how they join.' }}
      />
      {role === Role.tutor ? (
        students.length > 0 ? (
          <CheckboxGroupField
            idPrefix="invite"
            label="Children they may see"
            help="A tutor sees only these children’s misses, photos and plans."
            options={students.map((s) => ({ value: s.id, label: s.name }))}
            control={control}
            name="studentIds"
            rules={{
              validate: (ids: number[]) =>
                ids.length > 0 || 'Tick at least one child the tutor may see.',
            }}
          />
        ) : (
          <Callout intent={Intent.WARNING} className="wb-form-error">
            Add a student first: a tutor needs at least one child to look over.
          </Callout>
        )
      ) : null}
    </DialogForm>
  );
}

/** Invite a second parent or a tutor by e-mail; fresh each time it opens. */
export function InviteDialog({
  open,
  students,
  onClose,
}: {
  open: boolean;
  students: readonly StudentRef[];
  onClose: () => void;
}) {
  return (
    <Dialog isOpen={open} onClose={onClose} title="Invite someone" className="wb-dialog">
      {open ? <InviteForm students={students} onClose={onClose} /> : null}
    </Dialog>
  );
}

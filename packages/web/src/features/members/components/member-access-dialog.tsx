import { Dialog } from '@blueprintjs/core';
import { Role } from '@workback/core';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { CheckboxGroupField } from '../../../components/form/checkbox-group-field';
import { DialogForm } from '../../../components/form/dialog-form';
import { SelectField } from '../../../components/form/select-field';
import { useToast } from '../../../components/toaster';
import { useUpdateMember } from '../api/update-member';
import type { Member, MemberChanges, StudentRef } from '../types';
import { ROLE_CHOICES } from './invite-dialog';

type AccessValues = { role: string; studentIds: number[] };

const FIELDS = ['role', 'studentIds'] as const;

type AccessProps = {
  member: Member;
  students: readonly StudentRef[];
  /** Only an owner may make someone an owner. */
  viewerIsOwner: boolean;
  onClose: () => void;
};

function AccessForm({ member, students, viewerIsOwner, onClose }: AccessProps) {
  const toast = useToast();
  const update = useUpdateMember();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    control,
    handleSubmit,
    setError,
    formState: { isSubmitting },
  } = useForm<AccessValues>({
    defaultValues: { role: member.role, studentIds: member.studentIds ?? [] },
  });
  const role = useWatch({ control, name: 'role' });
  const roles = [
    ...(viewerIsOwner || member.role === Role.owner
      ? [{ value: Role.owner, label: ROLE_CHOICES.owner }]
      : []),
    { value: Role.parent, label: ROLE_CHOICES.parent },
    { value: Role.tutor, label: ROLE_CHOICES.tutor },
  ];

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const changes: MemberChanges = {};
    if (values.role !== member.role) changes.role = values.role as Role;
    if (values.role === Role.tutor) changes.studentIds = values.studentIds;
    if (changes.role === undefined && changes.studentIds === undefined) {
      onClose();
      return;
    }
    try {
      await update.mutateAsync({ id: member.id, ...changes });
      toast(`Saved ${member.displayName}’s access.`);
      onClose();
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <DialogForm
      label={`Change ${member.displayName}’s access`}
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText="Save access"
      submitting={isSubmitting}
    >
      <SelectField
        idPrefix="access"
        label="Role"
        options={roles}
        control={control}
        name="role"
        rules={{ required: 'Choose a role.' }}
      />
      {role === Role.tutor ? (
        <CheckboxGroupField
          idPrefix="access"
          label="Children they may see"
          help="The change takes effect on their next click."
          options={students.map((s) => ({ value: s.id, label: s.name }))}
          control={control}
          name="studentIds"
          rules={{
            validate: (ids: number[]) =>
              ids.length > 0 || 'Tick at least one child the tutor may see.',
          }}
        />
      ) : null}
    </DialogForm>
  );
}

/** Change a member's role, or which children a tutor may see. */
export function MemberAccessDialog({
  member,
  ...props
}: Omit<AccessProps, 'member'> & { member: Member | null }) {
  return (
    <Dialog
      isOpen={member !== null}
      onClose={props.onClose}
      title={member ? `${member.displayName}’s access` : 'Access'}
      className="wb-dialog"
    >
      {member ? <AccessForm key={member.id} member={member} {...props} /> : null}
    </Dialog>
  );
}

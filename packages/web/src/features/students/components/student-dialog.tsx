import { Dialog } from '@blueprintjs/core';
import { GRADE_LEVELS } from '@workback/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { DialogForm } from '../../../components/form/dialog-form';
import { SelectField } from '../../../components/form/select-field';
import { TextField } from '../../../components/form/text-field';
import { useToast } from '../../../components/toaster';
import { useCreateStudent } from '../api/create-student';
import { useUpdateStudent } from '../api/update-student';
import { gradeLabel, type Student, type StudentInput } from '../types';

const FIELDS = ['name', 'gradeLevel'] as const;
const NAME_MAX = 40;

const GRADE_OPTIONS = [
  { value: '', label: 'Choose a grade' },
  ...GRADE_LEVELS.map((grade) => ({ value: grade, label: gradeLabel(grade) })),
];

type StudentDialogProps = {
  /** The student to edit, or `null` to add a new one. */
  student: Student | null;
  onClose: () => void;
};

function StudentForm({ student, onClose }: StudentDialogProps) {
  const toast = useToast();
  const create = useCreateStudent();
  const update = useUpdateStudent();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<StudentInput>({
    defaultValues: { name: student?.name ?? '', gradeLevel: student?.gradeLevel ?? '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const input = { name: values.name.trim(), gradeLevel: values.gradeLevel };
    try {
      if (student) {
        const saved = await update.mutateAsync({ id: student.id, ...input });
        toast(`Saved ${saved.name}.`);
      } else {
        const saved = await create.mutateAsync(input);
        toast(`Added ${saved.name}.`);
      }
      onClose();
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <DialogForm
      label={student ? 'Edit student' : 'Add a student'}
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText={student ? 'Save changes' : 'Add student'}
      submitting={isSubmitting}
    >
      <TextField
        idPrefix="student"
        label="First name or nickname"
        help="That is all we need. No last names."
        autoComplete="off"
        autoFocus
        registration={register('name', {
          required: 'Enter a first name or nickname.',
          validate: (value) => value.trim().length > 0 || 'Enter a first name or nickname.',
          maxLength: { value: NAME_MAX, message: `Keep it under ${NAME_MAX} characters.` },
        })}
        error={errors.name?.message}
      />
      <SelectField
        idPrefix="student"
        label="Grade"
        help="The grade of the math they are working on now."
        options={GRADE_OPTIONS}
        control={control}
        name="gradeLevel"
        rules={{ required: 'Choose a grade.' }}
      />
    </DialogForm>
  );
}

/** Add or edit one child; the form is fresh each time the dialog opens. */
export function StudentDialog({ open, ...props }: StudentDialogProps & { open: boolean }) {
  return (
    <Dialog
      isOpen={open}
      onClose={props.onClose}
      title={props.student ? `Edit ${props.student.name}` : 'Add a student'}
      className="wb-dialog"
    >
      {open ? <StudentForm key={props.student?.id ?? 'new'} {...props} /> : null}
    </Dialog>
  );
}

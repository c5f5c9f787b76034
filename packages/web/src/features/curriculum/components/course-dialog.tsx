import { Dialog } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { DialogForm } from '../../../components/form/dialog-form';
import { TextField } from '../../../components/form/text-field';
import { useToast } from '../../../components/toaster';
import { useCreateCourse } from '../api/create-course';
import { useUpdateCourse } from '../api/update-course';
import type { Course } from '../types';

type Values = { name: string; level: string };
const FIELDS = ['name', 'level'] as const;

type CourseDialogProps = { course: Course | null; onClose: () => void };

function CourseForm({ course, onClose }: CourseDialogProps) {
  const toast = useToast();
  const create = useCreateCourse();
  const update = useUpdateCourse();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values>({ defaultValues: { name: course?.name ?? '', level: course?.level ?? '' } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const input = { name: values.name.trim(), level: values.level.trim() || null };
    try {
      if (course) {
        const saved = await update.mutateAsync({ id: course.id, ...input });
        toast(`Saved ${saved.name}.`);
      } else {
        const saved = await create.mutateAsync(input);
        toast(`Added ${saved.name}. Now add its lessons.`);
      }
      onClose();
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <DialogForm
      label={course ? 'Edit course' : 'Add a course'}
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText={course ? 'Save changes' : 'Add course'}
      submitting={isSubmitting}
    >
      <TextField
        idPrefix="course"
        label="Course name"
        help="As you call it at home, e.g. “Number trail, book 3”."
        autoComplete="off"
        autoFocus
        registration={register('name', {
          validate: (value) => value.trim().length > 0 || 'Give the course a name.',
          maxLength: { value: 80, message: 'Keep it under 80 characters.' },
        })}
        error={errors.name?.message}
      />
      <TextField
        idPrefix="course"
        label="Level (optional)"
        help="A grade, book or level, if the course has one."
        autoComplete="off"
        registration={register('level', {
          maxLength: { value: 40, message: 'Keep it under 40 characters.' },
        })}
        error={errors.level?.message}
      />
    </DialogForm>
  );
}

/** Add or rename a course; the form is fresh each time the dialog opens. */
export function CourseDialog({ open, ...props }: CourseDialogProps & { open: boolean }) {
  return (
    <Dialog
      isOpen={open}
      onClose={props.onClose}
      title={props.course ? `Edit ${props.course.name}` : 'Add a course'}
      className="wb-dialog"
    >
      {open ? <CourseForm key={props.course?.id ?? 'new'} {...props} /> : null}
    </Dialog>
  );
}

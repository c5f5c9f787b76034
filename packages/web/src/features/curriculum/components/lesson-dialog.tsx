import { Dialog } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { DialogForm } from '../../../components/form/dialog-form';
import { TextField } from '../../../components/form/text-field';
import { useToast } from '../../../components/toaster';
import { useUpdateLesson } from '../api/update-lesson';
import { splitList, type Lesson } from '../types';
import { lessonRules, type LessonValues } from './lesson-rules';

const FIELDS = ['number', 'title', 'skills'] as const;

type LessonDialogProps = { lesson: Lesson | null; onClose: () => void };

function LessonForm({ lesson, onClose }: { lesson: Lesson; onClose: () => void }) {
  const toast = useToast();
  const update = useUpdateLesson();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<LessonValues>({
    defaultValues: {
      number: String(lesson.number),
      title: lesson.title,
      skills: lesson.skills.join('; '),
    },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const saved = await update.mutateAsync({
        id: lesson.id,
        number: Number(values.number),
        title: values.title.trim(),
        skills: splitList(values.skills),
      });
      toast(`Saved lesson ${saved.number}.`);
      onClose();
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <DialogForm
      label="Edit lesson"
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText="Save changes"
      submitting={isSubmitting}
    >
      <TextField
        idPrefix="lesson-edit"
        label="Lesson number"
        inputMode="numeric"
        autoComplete="off"
        registration={register('number', lessonRules.number)}
        error={errors.number?.message}
      />
      <TextField
        idPrefix="lesson-edit"
        label="Title"
        autoComplete="off"
        autoFocus
        registration={register('title', lessonRules.title)}
        error={errors.title?.message}
      />
      <TextField
        idPrefix="lesson-edit"
        label="Skills (optional)"
        help="Separate skills with ; — e.g. “subtraction; regrouping”."
        autoComplete="off"
        registration={register('skills')}
        error={errors.skills?.message}
      />
    </DialogForm>
  );
}

export function LessonDialog({ lesson, onClose }: LessonDialogProps) {
  return (
    <Dialog
      isOpen={lesson !== null}
      onClose={onClose}
      title={lesson ? `Edit lesson ${lesson.number}` : 'Edit lesson'}
      className="wb-dialog"
    >
      {lesson ? <LessonForm key={lesson.id} lesson={lesson} onClose={onClose} /> : null}
    </Dialog>
  );
}

import { Button, FormGroup, InputGroup, Intent } from '@blueprintjs/core';
import { PlusIcon } from '@blueprintjs/icons';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { fieldIds } from '../../../components/form/field-ids';
import { FormError } from '../../../components/form/form-error';
import { useToast } from '../../../components/toaster';
import { useCreateLesson } from '../api/create-lesson';
import { splitList, type Course } from '../types';
import { lessonRules, type LessonValues } from './lesson-rules';

const FIELDS = ['number', 'title', 'skills'] as const;

/**
 * One line to add a lesson: number (the next one filled in), title, skills; Enter adds it and
 * leaves the cursor in the title for the next.
 */
export function QuickAddLesson({ course, nextNumber }: { course: Course; nextNumber: number }) {
  const toast = useToast();
  const create = useCreateLesson();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<LessonValues>({
    values: { number: String(nextNumber), title: '', skills: '' },
    resetOptions: { keepDirtyValues: true },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const lesson = await create.mutateAsync({
        courseId: course.id,
        number: Number(values.number),
        title: values.title.trim(),
        skills: splitList(values.skills),
      });
      toast(`Added lesson ${lesson.number}.`);
      reset({ number: String(lesson.number + 1), title: '', skills: '' });
      setFocus('title');
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  const prefix = `quick-lesson-${course.id}`;
  const field = (name: keyof LessonValues) => fieldIds(name, prefix);
  const number = register('number', lessonRules.number);
  const title = register('title', lessonRules.title);
  const skills = register('skills');

  return (
    <form
      className="wb-quick-add"
      onSubmit={onSubmit}
      noValidate
      aria-label={`Add a lesson to ${course.name}`}
    >
      <FormError message={formError} />
      <div className="wb-quick-add-fields">
        <FormGroup
          label="No."
          labelFor={field('number').id}
          className="wb-quick-number"
          intent={errors.number ? Intent.DANGER : Intent.NONE}
          helperText={
            errors.number ? (
              <span id={field('number').describedBy}>{errors.number.message}</span>
            ) : undefined
          }
        >
          <InputGroup
            id={field('number').id}
            inputRef={number.ref}
            name={number.name}
            onChange={number.onChange}
            onBlur={number.onBlur}
            inputMode="numeric"
            autoComplete="off"
            aria-invalid={errors.number ? true : undefined}
            aria-describedby={errors.number ? field('number').describedBy : undefined}
          />
        </FormGroup>
        <FormGroup
          label="New lesson title"
          labelFor={field('title').id}
          className="wb-quick-title"
          intent={errors.title ? Intent.DANGER : Intent.NONE}
          helperText={
            errors.title ? (
              <span id={field('title').describedBy}>{errors.title.message}</span>
            ) : undefined
          }
        >
          <InputGroup
            id={field('title').id}
            inputRef={title.ref}
            name={title.name}
            onChange={title.onChange}
            onBlur={title.onBlur}
            autoComplete="off"
            aria-invalid={errors.title ? true : undefined}
            aria-describedby={errors.title ? field('title').describedBy : undefined}
          />
        </FormGroup>
        <FormGroup
          label="Skills (with ;)"
          labelFor={field('skills').id}
          className="wb-quick-skills"
        >
          <InputGroup
            id={field('skills').id}
            inputRef={skills.ref}
            name={skills.name}
            onChange={skills.onChange}
            onBlur={skills.onBlur}
            autoComplete="off"
          />
        </FormGroup>
        <Button
          type="submit"
          icon={<PlusIcon />}
          loading={isSubmitting}
          className="wb-quick-submit"
          variant="outlined"
        >
          Add lesson
        </Button>
      </div>
    </form>
  );
}

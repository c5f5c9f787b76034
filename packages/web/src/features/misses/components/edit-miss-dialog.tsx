import { Dialog } from '@blueprintjs/core';
import { useState } from 'react';
import { useController, useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { DialogForm } from '../../../components/form/dialog-form';
import { TextAreaField } from '../../../components/form/text-area-field';
import { TextField } from '../../../components/form/text-field';
import { useToast } from '../../../components/toaster';
import { useUpdateMiss } from '../api/update-miss';
import { today, type Miss, type MissChanges } from '../types';
import { CausePicker } from './cause-picker';

type Values = Required<
  Pick<MissChanges, 'occurredOn' | 'problem' | 'answer' | 'explanation' | 'cause' | 'note'>
>;

const FIELDS = ['occurredOn', 'problem', 'answer', 'explanation', 'cause', 'note'] as const;

function EditMissForm({ miss, onClose }: { miss: Miss; onClose: () => void }) {
  const toast = useToast();
  const update = useUpdateMiss();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values>({
    defaultValues: {
      occurredOn: miss.occurredOn,
      problem: miss.problem,
      answer: miss.answer,
      explanation: miss.explanation,
      cause: miss.cause,
      note: miss.note,
    },
  });
  const { field: cause } = useController({ control, name: 'cause' });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await update.mutateAsync({
        id: miss.id,
        ...values,
        problem: values.problem.trim(),
        answer: values.answer.trim(),
        note: values.note.trim(),
      });
      toast('Saved the changes.');
      onClose();
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <DialogForm
      label="Edit the miss"
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText="Save changes"
      submitting={isSubmitting}
    >
      <TextField
        idPrefix="edit"
        label="Date of the work"
        type="date"
        registration={register('occurredOn', {
          required: 'Enter the day of the worksheet.',
          validate: (value) => value <= today() || 'The day cannot be in the future.',
        })}
        error={errors.occurredOn?.message}
      />
      <TextField
        idPrefix="edit"
        label="The problem"
        autoComplete="off"
        help="Changing the problem or the answer runs the checkers again."
        registration={register('problem', {
          validate: (value) => value.trim().length > 0 || 'Type the problem as it was written.',
        })}
        error={errors.problem?.message}
      />
      <TextField
        idPrefix="edit"
        label="The child’s answer"
        autoComplete="off"
        registration={register('answer', {
          validate: (value) => value.trim().length > 0 || 'Type the answer the child wrote.',
        })}
        error={errors.answer?.message}
      />
      <TextAreaField
        idPrefix="edit"
        label="What the child said"
        registration={register('explanation', {
          maxLength: { value: 2000, message: 'Keep it under 2000 characters.' },
        })}
        error={errors.explanation?.message}
      />
      <CausePicker
        name="edit-cause"
        value={cause.value}
        onChange={cause.onChange}
        suggestion={miss.diagnosis?.suggestedCause ?? null}
      />
      <TextAreaField
        idPrefix="edit"
        label="Your note"
        rows={2}
        registration={register('note', {
          maxLength: { value: 2000, message: 'Keep it under 2000 characters.' },
        })}
        error={errors.note?.message}
      />
    </DialogForm>
  );
}

/** Change what was logged; the form is fresh each time it opens. */
export function EditMissDialog({
  miss,
  open,
  onClose,
}: {
  miss: Miss;
  open: boolean;
  onClose: () => void;
}) {
  return (
    <Dialog
      isOpen={open}
      onClose={onClose}
      title="Edit the miss"
      className="wb-dialog wb-dialog-wide"
    >
      {open ? <EditMissForm miss={miss} onClose={onClose} /> : null}
    </Dialog>
  );
}

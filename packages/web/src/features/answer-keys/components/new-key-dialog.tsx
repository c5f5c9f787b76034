import { Dialog } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { DialogForm } from '../../../components/form/dialog-form';
import { useToast } from '../../../components/toaster';
import { paths } from '../../../config/paths';
import { useCreateAnswerKey } from '../api/create-answer-key';
import type { CourseOption } from '../types';
import {
  emptyKeyFields,
  KEY_FIELD_NAMES,
  KeyFields,
  toKeyFields,
  type KeyFieldValues,
} from './key-fields';

function NewKeyForm({
  courses,
  onClose,
}: {
  courses: readonly CourseOption[];
  onClose: () => void;
}) {
  const toast = useToast();
  const navigate = useNavigate();
  const create = useCreateAnswerKey();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<KeyFieldValues>({ defaultValues: emptyKeyFields });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const key = await create.mutateAsync({ ...toKeyFields(values), items: [] });
      toast(`Made ${key.title}. Type its items below.`);
      onClose();
      void navigate(paths.app.answerKey.getHref(key.id));
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, KEY_FIELD_NAMES));
    }
  });

  return (
    <DialogForm
      label="New answer key"
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText="Make the key"
      submitting={isSubmitting}
    >
      <KeyFields
        idPrefix="new-key"
        courses={courses}
        register={register}
        control={control}
        errors={errors}
        autoFocus
      />
    </DialogForm>
  );
}

/** Names a new key; its items are typed in the key editor it opens. */
export function NewKeyDialog({
  open,
  courses,
  onClose,
}: {
  open: boolean;
  courses: readonly CourseOption[];
  onClose: () => void;
}) {
  return (
    <Dialog isOpen={open} onClose={onClose} title="New answer key" className="wb-dialog">
      {open ? <NewKeyForm courses={courses} onClose={onClose} /> : null}
    </Dialog>
  );
}

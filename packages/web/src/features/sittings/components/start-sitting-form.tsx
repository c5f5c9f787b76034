import { Button, Card, Intent } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';

import { CalmDayCallout } from '../../../components/calm-day-callout';
import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { SelectField } from '../../../components/form/select-field';
import { TextAreaField } from '../../../components/form/text-area-field';
import { TextField } from '../../../components/form/text-field';
import { validMinutes } from '../../../components/form/minutes-taken';
import { YES_NO, yesNo } from '../../../components/form/yes-no';
import { useToast } from '../../../components/toaster';
import { localNow } from '../../../lib/local-time';
import { paths } from '../../../config/paths';
import { isSameDayFollowUp } from '../../../lib/calm-day';
import { useCreateSitting } from '../api/create-sitting';
import { useSittings } from '../api/get-sittings';

export type StudentOption = { id: number; name: string };
export type KeyOption = { id: number; title: string; kind: string; itemCount: number };

type Values = {
  studentId: string;
  answerKeyId: string;
  startedAt: string;
  minutes: string;
  rested: string;
  afterMeal: string;
  note: string;
};

const FIELDS = ['studentId', 'answerKeyId', 'startedAt', 'minutes', 'note'] as const;

/** Starts a sitting: who, which key, when and under what conditions; then on to marking. */
export function StartSittingForm({
  students,
  keys,
  defaults,
}: {
  students: readonly StudentOption[];
  keys: readonly KeyOption[];
  defaults?: { studentId?: number; answerKeyId?: number };
}) {
  const toast = useToast();
  const navigate = useNavigate();
  const create = useCreateSitting();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values>({
    defaultValues: {
      studentId: defaults?.studentId
        ? String(defaults.studentId)
        : students.length === 1
          ? String(students[0]!.id)
          : '',
      answerKeyId: defaults?.answerKeyId ? String(defaults.answerKeyId) : '',
      startedAt: localNow(),
      minutes: '',
      rested: '',
      afterMeal: '',
      note: '',
    },
  });

  const [studentId, answerKeyId, startedAt] = useWatch({
    control,
    name: ['studentId', 'answerKeyId', 'startedAt'],
  });
  const key = keys.find((k) => String(k.id) === answerKeyId);
  const day = startedAt.slice(0, 10);
  const isReview = key?.kind === 'review';
  // A review sitting reviews the child's earlier work: same-day sittings get the gentle note.
  const sameDay = useSittings(
    { studentId: Number(studentId), from: day, to: day },
    { enabled: isReview && !!studentId && /^\d{4}-\d{2}-\d{2}$/.test(day) },
  );
  const reviewedToday =
    isReview &&
    isSameDayFollowUp(
      day,
      (sameDay.data?.items ?? []).filter((s) => s.answerKeyId !== key.id).map((s) => s.startedAt),
    );

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const sitting = await create.mutateAsync({
        studentId: Number(values.studentId),
        answerKeyId: Number(values.answerKeyId),
        startedAt: values.startedAt,
        minutes: values.minutes.trim() ? Number(values.minutes) : null,
        conditions: {
          rested: yesNo(values.rested),
          afterMeal: yesNo(values.afterMeal),
          note: values.note.trim() || null,
        },
      });
      toast('Sitting started. Mark each item.');
      void navigate(paths.app.sitting.getHref(sitting.id));
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, FIELDS));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Start a sitting" className="wb-form-narrow">
      <FormError message={formError} />
      <Card className="wb-panel">
        <SelectField
          idPrefix="sitting"
          label="Student"
          control={control}
          name="studentId"
          rules={{ required: 'Choose who sat it.' }}
          options={[
            { value: '', label: 'Choose a student' },
            ...students.map((s) => ({ value: String(s.id), label: s.name })),
          ]}
        />
        <SelectField
          idPrefix="sitting"
          label="Answer key"
          help="The worksheet, review or assessment they did."
          control={control}
          name="answerKeyId"
          rules={{ required: 'Choose the answer key.' }}
          options={[
            { value: '', label: 'Choose a key' },
            ...keys.map((k) => ({
              value: String(k.id),
              label: `${k.title} (${k.itemCount} items)`,
            })),
          ]}
        />
        <TextField
          idPrefix="sitting"
          label="Started"
          type="datetime-local"
          help="Your own clock time; it shows which time of day suits your child."
          registration={register('startedAt', {
            validate: (value) =>
              /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/.test(value) ||
              'Choose the date and time it started.',
          })}
          error={errors.startedAt?.message}
        />
        {reviewedToday ? <CalmDayCallout what="This review sitting" /> : null}
        <TextField
          idPrefix="sitting"
          label="Minutes taken (optional)"
          inputMode="numeric"
          autoComplete="off"
          registration={register('minutes', { validate: validMinutes })}
          error={errors.minutes?.message}
        />
      </Card>
      <Card className="wb-panel">
        <h2 className="wb-subhead">How were things? (optional)</h2>
        <div className="wb-two-up">
          <SelectField
            idPrefix="sitting"
            label="Well rested?"
            control={control}
            name="rested"
            options={YES_NO}
          />
          <SelectField
            idPrefix="sitting"
            label="Soon after a meal?"
            control={control}
            name="afterMeal"
            options={YES_NO}
          />
        </div>
        <TextAreaField
          idPrefix="sitting"
          label="Note"
          rows={2}
          placeholder="e.g. a bit distracted by the rain"
          registration={register('note', {
            maxLength: { value: 300, message: 'At most 300 characters.' },
          })}
          error={errors.note?.message}
        />
      </Card>
      <div className="wb-save-bar">
        <Button type="submit" intent={Intent.PRIMARY} size="large" loading={isSubmitting}>
          Start marking
        </Button>
      </div>
    </form>
  );
}

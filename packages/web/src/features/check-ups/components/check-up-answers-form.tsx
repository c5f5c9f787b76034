import { Button, Card, Intent } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { SelectField } from '../../../components/form/select-field';
import { TextField } from '../../../components/form/text-field';
import { validMinutes } from '../../../components/form/minutes-taken';
import { YES_NO, yesNo } from '../../../components/form/yes-no';
import { useToast } from '../../../components/toaster';
import { localNow } from '../../../lib/local-time';
import { useAnswerCheckUp } from '../api/answer-check-up';
import type { CheckUp } from '../types';
import '../check-ups.css';

type Values = {
  startedAt: string;
  minutes: string;
  rested: string;
  afterMeal: string;
  answers: string[];
};

/**
 * The child's answers, one quick field per problem (Enter moves on), with when it was done
 * and how things were: saved as a sitting, so it counts in the time-of-day summary too.
 */
export function CheckUpAnswersForm({ checkUp }: { checkUp: CheckUp }) {
  const save = useAnswerCheckUp();
  const toast = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values>({
    defaultValues: {
      startedAt: localNow(),
      minutes: '',
      rested: '',
      afterMeal: '',
      answers: checkUp.problems.map(() => ''),
    },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await save.mutateAsync({
        id: checkUp.id,
        startedAt: values.startedAt,
        minutes: values.minutes.trim() ? Number(values.minutes) : null,
        conditions: {
          rested: yesNo(values.rested),
          afterMeal: yesNo(values.afterMeal),
          note: null,
        },
        answers: values.answers.map((a) => (a.trim() === '' ? null : a.trim())),
      });
      toast('Answers saved. Here is what they say.');
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, ['startedAt', 'minutes', 'answers']));
    }
  });

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label="The child’s answers"
      className="wb-form-narrow"
    >
      <FormError message={formError ?? errors.answers?.root?.message ?? errors.answers?.message} />
      <Card className="wb-panel">
        <h2 className="wb-subhead">What your child wrote</h2>
        <p className="wb-muted">
          Type each answer as it stands on the sheet, slips and all. Leave a blank for a problem not
          done.
        </p>
        {checkUp.problems.map((p, i) => (
          <TextField
            key={p.problem}
            idPrefix="check-up"
            label={`${i + 1}. ${p.problem}`}
            autoComplete="off"
            registration={register(`answers.${i}`)}
            error={errors.answers?.[i]?.message}
          />
        ))}
      </Card>
      <Card className="wb-panel">
        <h2 className="wb-subhead">When, and how things were</h2>
        <TextField
          idPrefix="check-up"
          label="Done at"
          type="datetime-local"
          registration={register('startedAt', {
            validate: (value) =>
              /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/.test(value) || 'Choose the date and time.',
          })}
          error={errors.startedAt?.message}
        />
        <TextField
          idPrefix="check-up"
          label="Minutes taken (optional)"
          inputMode="numeric"
          autoComplete="off"
          registration={register('minutes', { validate: validMinutes })}
          error={errors.minutes?.message}
        />
        <div className="wb-two-up">
          <SelectField
            idPrefix="check-up"
            label="Well rested?"
            control={control}
            name="rested"
            options={YES_NO}
          />
          <SelectField
            idPrefix="check-up"
            label="Soon after a meal?"
            control={control}
            name="afterMeal"
            options={YES_NO}
          />
        </div>
      </Card>
      <div className="wb-checkup-actions">
        <Button type="submit" intent={Intent.PRIMARY} size="large" loading={isSubmitting}>
          Save the answers
        </Button>
      </div>
    </form>
  );
}

import { Button, Checkbox, Classes, HTMLSelect, Intent } from '@blueprintjs/core';
import { CAUSE_GUIDE } from '@workback/core';
import { useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';

import { CalmDayCallout } from '../../../components/calm-day-callout';
import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextField } from '../../../components/form/text-field';
import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { isSameDayFollowUp } from '../../../lib/calm-day';
import { useCreateReviewPlan } from '../api/create-review-plan';
import { useOpenMisses } from '../api/get-open-misses';
import { shortDay, type ReviewPlan, type StudentRef } from '../types';

import '../review-plans.css';

const DAY = /^\d{4}-\d{2}-\d{2}$/;

function tomorrow(): string {
  const d = new Date();
  d.setDate(d.getDate() + 1);
  const m = String(d.getMonth() + 1).padStart(2, '0');
  return `${d.getFullYear()}-${m}-${String(d.getDate()).padStart(2, '0')}`;
}

function PlanForm({
  studentId,
  studentName,
  onCreated,
}: {
  studentId: number;
  studentName: string;
  onCreated: (plan: ReviewPlan) => void;
}) {
  const misses = useOpenMisses(studentId);
  const create = useCreateReviewPlan();
  const [formError, setFormError] = useState<string | null>(null);
  // Unticked misses; by default every open miss since the last plan is on the new one.
  const [left, setLeft] = useState<ReadonlySet<number>>(new Set());
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<{ scheduledFor: string }>({ defaultValues: { scheduledFor: tomorrow() } });
  const scheduledFor = useWatch({ control, name: 'scheduledFor' });
  const chosen = useMemo(
    () => (misses.data ?? []).filter((m) => !left.has(m.id)),
    [misses.data, left],
  );

  if (misses.isPending) return <LoadingState label={`Loading ${studentName}’s open misses…`} />;
  if (misses.isError) {
    return (
      <ErrorState
        title="The open misses could not be loaded."
        error={misses.error}
        onRetry={() => void misses.refetch()}
      />
    );
  }
  if (misses.data.length === 0) {
    return (
      <EmptyState
        title={`${studentName} has no open misses since the last plan. Log the misses of the next worksheet first.`}
      />
    );
  }

  const onSubmit = handleSubmit(async ({ scheduledFor: day }) => {
    setFormError(null);
    if (chosen.length === 0) {
      setFormError('Tick at least one miss for the plan.');
      return;
    }
    try {
      onCreated(
        await create.mutateAsync({
          studentId,
          scheduledFor: day,
          missIds: chosen.map((m) => m.id),
        }),
      );
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, ['scheduledFor']));
    }
  });

  const toggle = (id: number, on: boolean) =>
    setLeft((current) => {
      const next = new Set(current);
      if (on) next.delete(id);
      else next.add(id);
      return next;
    });

  const sameDay =
    DAY.test(scheduledFor) &&
    isSameDayFollowUp(
      scheduledFor,
      chosen.map((m) => m.occurredOn),
    );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Build a review plan" className="wb-plan-form">
      <FormError message={formError} />
      <TextField
        idPrefix="plan"
        label="Day of the review"
        type="date"
        help="Pick a calm day, at the time of day your child works best."
        registration={register('scheduledFor', {
          required: 'Choose the day of the review.',
          pattern: { value: DAY, message: 'Choose a day from the calendar.' },
        })}
        error={errors.scheduledFor?.message}
      />
      {sameDay ? <CalmDayCallout what="This review" /> : null}
      <fieldset className="wb-checkbox-group wb-plan-misses">
        <legend className={Classes.LABEL}>
          Misses to review ({chosen.length} of {misses.data.length} ticked)
        </legend>
        <p className="wb-muted">
          All the open misses since the last plan are ticked. Untick any to leave out.
        </p>
        <div className="wb-plan-miss-actions">
          <Button size="small" variant="minimal" onClick={() => setLeft(new Set())}>
            Tick all
          </Button>
          <Button
            size="small"
            variant="minimal"
            onClick={() => setLeft(new Set(misses.data.map((m) => m.id)))}
          >
            Untick all
          </Button>
        </div>
        <ul className="wb-plan-miss-list">
          {misses.data.map((miss) => (
            <li key={miss.id}>
              <Checkbox
                checked={!left.has(miss.id)}
                onChange={(e) => toggle(miss.id, e.currentTarget.checked)}
                labelElement={
                  <span className="wb-plan-miss">
                    <span className="wb-mono">
                      {miss.problem} → {miss.answer}
                    </span>{' '}
                    <span className="wb-muted">
                      {shortDay(miss.occurredOn)} · {CAUSE_GUIDE[miss.cause].label}
                    </span>
                  </span>
                }
              />
            </li>
          ))}
        </ul>
      </fieldset>
      <Button type="submit" intent={Intent.PRIMARY} size="large" loading={create.isPending}>
        Build the plan
      </Button>
    </form>
  );
}

/** Build a plan: a day for the review and the misses it covers. */
export function NewPlanForm({
  students,
  studentId,
  onStudent,
  onCreated,
}: {
  students: readonly StudentRef[];
  studentId: number;
  onStudent: (studentId: number) => void;
  onCreated: (plan: ReviewPlan) => void;
}) {
  const name = students.find((s) => s.id === studentId)?.name ?? 'This student';
  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Build a review plan</h1>
          <p className="wb-muted">
            Workback turns the chosen misses into lessons to revisit, fact families to drill and
            fresh problems that practise the same steps.
          </p>
        </div>
      </div>
      <div className="wb-plan-filters">
        <label htmlFor="new-plan-student" className={Classes.LABEL}>
          Student
        </label>
        <HTMLSelect
          id="new-plan-student"
          value={String(studentId)}
          onChange={(e) => onStudent(Number(e.currentTarget.value))}
          options={students.map((s) => ({ value: String(s.id), label: s.name }))}
        />
      </div>
      <PlanForm key={studentId} studentId={studentId} studentName={name} onCreated={onCreated} />
    </>
  );
}

import { Card, Classes, HTMLSelect, ProgressBar, Tag } from '@blueprintjs/core';
import { ClipboardIcon, PlusIcon } from '@blueprintjs/icons';
import { Link } from 'react-router-dom';

import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { paths } from '../../../config/paths';
import { useReviewPlans } from '../api/get-review-plans';
import { longDay, type StudentRef } from '../types';

import '../review-plans.css';

function NewPlanLink({ studentId }: { studentId: number }) {
  return (
    <Link
      className={`${Classes.BUTTON} ${Classes.INTENT_PRIMARY} wb-plan-new`}
      to={paths.app.newReviewPlan.getHref(studentId)}
    >
      <PlusIcon />
      <span className={Classes.BUTTON_TEXT}>Build a review plan</span>
    </Link>
  );
}

/** One student's review plans, newest review day first, with their progress. */
export function PlansList({
  students,
  studentId,
  onStudent,
}: {
  students: readonly StudentRef[];
  studentId: number;
  onStudent: (studentId: number) => void;
}) {
  const plans = useReviewPlans(studentId);
  const name = students.find((s) => s.id === studentId)?.name ?? 'this student';

  let body;
  if (plans.isPending) {
    body = <LoadingState label="Loading review plans…" />;
  } else if (plans.isError) {
    body = (
      <ErrorState
        title="The review plans could not be loaded."
        error={plans.error}
        onRetry={() => void plans.refetch()}
      />
    );
  } else if (plans.data.items.length === 0) {
    body = (
      <EmptyState
        icon={<ClipboardIcon size={40} />}
        title={`No review plans for ${name} yet. Build one from the misses logged since the last review.`}
        action={<NewPlanLink studentId={studentId} />}
      />
    );
  } else {
    body = (
      <ul className="wb-cards" aria-label={`Review plans for ${name}`}>
        {plans.data.items.map((plan) => (
          <li key={plan.id}>
            <Card className="wb-card wb-plan-card">
              <div className="wb-card-main">
                <Link className="wb-card-title" to={paths.app.reviewPlan.getHref(plan.id)}>
                  Review on {longDay(plan.scheduledFor)}
                </Link>
                <span className="wb-muted">
                  {plan.missCount === 1 ? '1 miss' : `${plan.missCount} misses`}
                  {plan.lessonsText ? ` · ${plan.lessonsText}` : ''}
                </span>
              </div>
              <div className="wb-plan-progress">
                <Tag
                  minimal
                  round
                  className={plan.status === 'done' ? 'wb-plan-done' : 'wb-plan-open'}
                >
                  {plan.status === 'done'
                    ? 'All done'
                    : `${plan.progress.done} of ${plan.progress.total} done`}
                </Tag>
                <ProgressBar
                  value={plan.progress.total ? plan.progress.done / plan.progress.total : 0}
                  animate={false}
                  stripes={false}
                  aria-label={`${plan.progress.done} of ${plan.progress.total} items done`}
                />
              </div>
            </Card>
          </li>
        ))}
      </ul>
    );
  }

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Review plans</h1>
          <p className="wb-muted">
            Lessons to revisit, facts to drill and problems to re-work, for a calm review day. Print
            them, or e-mail them to whoever sits with the child.
          </p>
        </div>
        {plans.isSuccess && plans.data.items.length > 0 ? (
          <NewPlanLink studentId={studentId} />
        ) : null}
      </div>
      <div className="wb-plan-filters">
        <label htmlFor="plans-student" className={Classes.LABEL}>
          Student
        </label>
        <HTMLSelect
          id="plans-student"
          value={String(studentId)}
          onChange={(e) => onStudent(Number(e.currentTarget.value))}
          options={students.map((s) => ({ value: String(s.id), label: s.name }))}
        />
      </div>
      {body}
    </>
  );
}

import { formatStartedAt, TIME_OF_DAY_LABEL, type SittingSummary } from '../types';

const yesNo = (value: boolean | null, yes: string, no: string) =>
  value === null ? null : value ? yes : no;

/** Who sat which key, when, and under what conditions. */
export function SittingHeader({
  sitting,
  studentName,
  title,
}: {
  sitting: SittingSummary;
  studentName: string;
  title: string;
}) {
  const { conditions } = sitting;
  const facts = [
    `${formatStartedAt(sitting.startedAt)} (${TIME_OF_DAY_LABEL[sitting.timeOfDay].toLowerCase()})`,
    sitting.minutes ? `${sitting.minutes} min` : null,
    yesNo(conditions.rested, 'well rested', 'tired'),
    yesNo(conditions.afterMeal, 'after a meal', 'before a meal'),
  ].filter(Boolean);
  return (
    <div className="wb-page-head">
      <div>
        <h1 className="wb-page-title">{title}</h1>
        <p className="wb-muted">
          <strong className="wb-ink">{studentName}</strong> · {sitting.answerKey?.title} ·{' '}
          {facts.join(' · ')}
        </p>
        {conditions.note ? <p className="wb-muted">“{conditions.note}”</p> : null}
      </div>
    </div>
  );
}

import { Card, Tag } from '@blueprintjs/core';
import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { notebookHref } from '../notebook-link';
import { recurringSentence, type PatternsResult } from '../types';
import { PatternNotes } from './pattern-notes';

type Recurring = PatternsResult['recurring'][number];

const STATUS_TEXT: Readonly<Record<Recurring['status'], string>> = {
  'not-reviewed': 'Not on a review plan yet',
  faded: 'Faded since the review',
  'seen-again': 'Seen again since the review',
};

function SinceReview({ pattern }: { pattern: Recurring }) {
  const plan = pattern.sincePlan;
  if (!plan)
    return (
      <Tag minimal round className="wb-status-tag">
        {STATUS_TEXT['not-reviewed']}
      </Tag>
    );
  return (
    <>
      <Tag minimal round className={`wb-status-tag wb-status-${pattern.status}`}>
        {STATUS_TEXT[pattern.status]}
      </Tag>{' '}
      <Link to={paths.app.reviewPlan.getHref(plan.planId)}>Open that review plan</Link>
    </>
  );
}

/** Where the numbers of one pattern lead: the Notebook filtered to its misses. */
function MissesLink({
  pattern,
  studentId,
  from,
  to,
}: {
  pattern: Recurring;
  studentId: number;
  from: string | null;
  to: string | null;
}) {
  const times = pattern.count === 1 ? '1 miss' : `${pattern.count} misses`;
  if (pattern.kind === 'rule' || pattern.kind === 'skill') {
    const filter =
      pattern.kind === 'rule'
        ? { studentId, rule: pattern.id, from, to }
        : { studentId, skill: pattern.id, from, to };
    return (
      <Link to={notebookHref(filter)} className="wb-pattern-link">
        See the {times} in the notebook
      </Link>
    );
  }
  // The notebook has no filter by fact, so each miss gets its own link.
  return (
    <span className="wb-pattern-link">
      See the {times}:{' '}
      {pattern.missIds.map((id, index) => (
        <Link
          key={id}
          to={paths.app.miss.getHref(id)}
          aria-label={`Miss ${index + 1} of ${pattern.count}`}
          className="wb-miss-number"
        >
          {index + 1}
        </Link>
      ))}
    </span>
  );
}

/** "Keeps coming back": the recurring patterns first, each in a plain sentence. */
export function RecurringList({
  patterns,
  studentName,
}: {
  patterns: PatternsResult;
  studentName: string;
}) {
  if (patterns.recurring.length === 0) {
    return (
      <p className="wb-empty-line">
        Nothing has come back three times within a month in this period. Log misses after each
        worksheet and patterns show up here.
      </p>
    );
  }
  return (
    <ul className="wb-cards wb-recurring" aria-label="Recurring patterns">
      {patterns.recurring.map((pattern) => (
        <li key={pattern.key}>
          <Card className="wb-recurring-card">
            <p className="wb-recurring-sentence">{recurringSentence(studentName, pattern)}</p>
            <p className="wb-recurring-meta">
              <SinceReview pattern={pattern} />
            </p>
            <p className="wb-recurring-meta">
              <MissesLink
                pattern={pattern}
                studentId={patterns.studentId}
                from={patterns.from}
                to={patterns.to}
              />
            </p>
            <PatternNotes
              studentId={patterns.studentId}
              patternKey={pattern.key}
              label={pattern.label}
              notes={pattern.notes}
            />
          </Card>
        </li>
      ))}
    </ul>
  );
}

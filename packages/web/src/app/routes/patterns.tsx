import type { QueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { useSearchParams } from 'react-router-dom';

import { ruleName } from '@workback/core';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { CheckUpOffer } from '../../features/check-ups/components/check-up-offer';
import type { CardActions } from '../../features/patterns/components/difficulty-cards';
import { EmptyState, ErrorState, LoadingState } from '../../components/states';
import type { PatternFilterValues } from '../../features/patterns/components/pattern-filters';
import { PatternsView } from '../../features/patterns/components/patterns-view';
import { DEFAULT_PERIOD, isPeriod } from '../../features/patterns/period';
import { studentsQueryOptions, useStudents } from '../../features/students/api/get-students';
import { meQueryOptions, useSignedIn } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && seesChildren(me)) void queryClient.prefetchQuery(studentsQueryOptions());
  return null;
};

function PatternsPage() {
  const students = useStudents();
  const [params, setParams] = useSearchParams();
  const onChange = useCallback(
    (changes: Partial<PatternFilterValues>) =>
      setParams(
        (current) => {
          const next = new URLSearchParams(current);
          for (const [name, value] of Object.entries(changes)) {
            const key = name === 'studentId' ? 'student' : name;
            if (value === '' || value === undefined) next.delete(key);
            else next.set(key, String(value));
          }
          if (next.get('period') !== 'custom') {
            next.delete('from');
            next.delete('to');
          }
          return next;
        },
        { replace: true },
      ),
    [setParams],
  );

  if (students.isPending) return <LoadingState label="Loading students…" />;
  if (students.isError) {
    return (
      <ErrorState
        title="The students could not be loaded."
        error={students.error}
        onRetry={() => void students.refetch()}
      />
    );
  }
  const list = students.data.items.map(({ id, name }) => ({ id, name }));
  if (list.length === 0) {
    return (
      <>
        <h1 className="wb-page-title">Patterns</h1>
        <EmptyState title="No students yet. Add a child on the Students page, then log their misses." />
      </>
    );
  }
  const wanted = Number(params.get('student'));
  const studentId = list.some((s) => s.id === wanted) ? wanted : list[0]!.id;
  const period = params.get('period');
  const filters: PatternFilterValues = {
    studentId,
    period: isPeriod(period) ? period : DEFAULT_PERIOD,
    from: params.get('from') ?? '',
    to: params.get('to') ?? '',
  };
  return (
    <PatternsView
      students={list}
      filters={filters}
      onChange={onChange}
      cardActions={checkUpOffer}
    />
  );
}

/** A method's card offers a check-up until one settles it. */
const checkUpOffer: CardActions = (card, studentId) =>
  card.kind === 'method' ? (
    <CheckUpOffer
      studentId={studentId}
      ruleIds={card.ruleIds.filter((id) => !id.endsWith('.fact')).slice(0, 4)}
      settled={card.status === 'finding'}
      problems={card.evidence.map((e) => e.problem)}
      latest={card.checkUp}
      ruleName={ruleName}
    />
  ) : null;

export default function PatternsRoute() {
  const me = useSignedIn();
  if (!seesChildren(me)) {
    return (
      <>
        <h1 className="wb-page-title">Patterns</h1>
        <NoHouseholdCallout me={me} />
      </>
    );
  }
  return <PatternsPage />;
}

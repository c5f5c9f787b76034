import type { QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { useSearchParams } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { EmptyState, ErrorState, LoadingState } from '../../components/states';
import { PlansList } from '../../features/review-plans/components/plans-list';
import { studentsQueryOptions, useStudents } from '../../features/students/api/get-students';
import { meQueryOptions, useSignedIn } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && seesChildren(me)) void queryClient.prefetchQuery(studentsQueryOptions());
  return null;
};

/** The students for the review-plan pages, and the one chosen in the address bar (`?student=`). */
export function useChosenStudent() {
  const students = useStudents();
  const [params, setParams] = useSearchParams();
  const list = (students.data?.items ?? []).map(({ id, name }) => ({ id, name }));
  const wanted = Number(params.get('student'));
  const studentId = list.some((s) => s.id === wanted) ? wanted : (list[0]?.id ?? 0);
  const choose = (id: number) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        next.set('student', String(id));
        return next;
      },
      { replace: true },
    );
  return { students, list, studentId, choose };
}

export function StudentsGate({
  title,
  children,
}: {
  title: string;
  children: (chosen: ReturnType<typeof useChosenStudent>) => ReactNode;
}) {
  const chosen = useChosenStudent();
  const { students, list } = chosen;
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
  if (list.length === 0) {
    return (
      <>
        <h1 className="wb-page-title">{title}</h1>
        <EmptyState title="No students yet. Add a child on the Students page, then log their misses." />
      </>
    );
  }
  return <>{children(chosen)}</>;
}

export default function ReviewPlansRoute() {
  const me = useSignedIn();
  if (!seesChildren(me)) {
    return (
      <>
        <h1 className="wb-page-title">Review plans</h1>
        <NoHouseholdCallout me={me} />
      </>
    );
  }
  return (
    <StudentsGate title="Review plans">
      {({ list, studentId, choose }) => (
        <PlansList students={list} studentId={studentId} onStudent={choose} />
      )}
    </StudentsGate>
  );
}

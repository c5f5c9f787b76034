import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { ErrorState, LoadingState } from '../../components/states';
import { missQueryOptions } from '../../features/misses/api/get-miss';
import { notesQueryOptions } from '../../features/misses/api/get-notes';
import { MakeCheckUpButton } from '../../features/check-ups/components/make-check-up-button';
import { MissView } from '../../features/misses/components/miss-view';
import type { Miss } from '../../features/misses/types';
import { studentsQueryOptions, useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';

const readId = (value: string | undefined) => {
  const id = Number(value);
  return Number.isInteger(id) && id > 0 ? id : null;
};

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const id = readId(params.missId);
    if (id === null) throw new Response('Not here', { status: 404 });
    const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    if (me && seesChildren(me)) {
      void queryClient.prefetchQuery(missQueryOptions(id));
      void queryClient.prefetchQuery(notesQueryOptions(id));
      void queryClient.prefetchQuery(studentsQueryOptions());
    }
    return null;
  };

function MissBody({ id, canEdit }: { id: number; canEdit: boolean }) {
  const students = useStudents();
  if (students.isPending) return <LoadingState label="Loading the miss…" />;
  if (students.isError) {
    return (
      <ErrorState
        title="This miss could not be loaded."
        error={students.error}
        onRetry={() => void students.refetch()}
      />
    );
  }
  return (
    <MissView
      missId={id}
      students={students.data.items}
      canEdit={canEdit}
      traceActions={checkUpOffer}
    />
  );
}

/** When several rules reproduce the answer, a check-up can tell them apart. */
function checkUpOffer(miss: Miss) {
  const ids = [...new Set((miss.diagnosis?.rules ?? []).flatMap((r) => r.id.split('+')))].slice(
    0,
    4,
  );
  if (ids.length < 2) return null;
  return (
    <p className="wb-muted">
      More than one way of working gives this answer.{' '}
      <MakeCheckUpButton studentId={miss.studentId} ruleIds={ids} problems={[miss.problem]} small />
    </p>
  );
}

export default function MissRoute() {
  const me = useSignedIn();
  const id = readId(useParams().missId);
  if (!seesChildren(me)) return <NoHouseholdCallout me={me} />;
  if (id === null) return null;
  return <MissBody key={id} id={id} canEdit={canEditHousehold(me)} />;
}

import type { QueryClient } from '@tanstack/react-query';
import { Link, Navigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { ErrorState, LoadingState } from '../../components/states';
import { paths } from '../../config/paths';
import { useAnswerKey } from '../../features/answer-keys/api/get-answer-key';
import { sittingQueryOptions, useSitting } from '../../features/sittings/api/get-sitting';
import { SittingMarking } from '../../features/sittings/components/sitting-marking';
import { useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';
import { readId } from './route-params';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const id = readId(params.sittingId);
    if (id === null) throw new Response('Not here', { status: 404 });
    const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    if (me && seesChildren(me)) void queryClient.prefetchQuery(sittingQueryOptions(id));
    return null;
  };

function Marking({ id }: { id: number }) {
  const sitting = useSitting(id);
  const key = useAnswerKey(sitting.data?.answerKeyId ?? null);
  const students = useStudents();
  if (sitting.isError || key.isError) {
    return (
      <ErrorState
        title="This sitting could not be loaded."
        error={sitting.error ?? key.error}
        onRetry={() => {
          void sitting.refetch();
          void key.refetch();
        }}
      />
    );
  }
  if (sitting.isPending || key.isPending) return <LoadingState label="Loading the sitting…" />;
  const name = students.data?.items.find((s) => s.id === sitting.data.studentId)?.name ?? '';
  return <SittingMarking sitting={sitting.data} items={key.data.items} studentName={name} />;
}

export default function SittingRoute() {
  const me = useSignedIn();
  const id = readId(useParams().sittingId);
  if (!seesChildren(me)) return <NoHouseholdCallout me={me} />;
  if (id === null) return null;
  // Tutors read the result; only owners and parents mark.
  if (!canEditHousehold(me)) return <Navigate to={paths.app.sittingMisses.getHref(id)} replace />;
  return (
    <>
      <p className="wb-backlink">
        <Link to={paths.app.sittings.getHref()}>← All sittings</Link>
      </p>
      <Marking key={id} id={id} />
    </>
  );
}

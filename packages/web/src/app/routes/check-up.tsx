import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { ErrorState, LoadingState } from '../../components/states';
import { paths } from '../../config/paths';
import { checkUpQueryOptions, useCheckUp } from '../../features/check-ups/api/get-check-up';
import { CheckUpView } from '../../features/check-ups/components/check-up-view';
import { useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';
import { readId } from './route-params';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const id = readId(params.checkUpId);
    if (id === null) throw new Response('Not here', { status: 404 });
    const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    if (me && seesChildren(me)) void queryClient.prefetchQuery(checkUpQueryOptions(id));
    return null;
  };

function CheckUpPage({ id, canEnter }: { id: number; canEnter: boolean }) {
  const checkUp = useCheckUp(id);
  const students = useStudents();
  if (checkUp.isError)
    return (
      <ErrorState
        title="This check-up could not be loaded."
        error={checkUp.error}
        onRetry={() => void checkUp.refetch()}
      />
    );
  if (checkUp.isPending) return <LoadingState label="Loading the check-up…" />;
  const name = students.data?.items.find((s) => s.id === checkUp.data.studentId)?.name ?? '';
  return <CheckUpView checkUp={checkUp.data} studentName={name} canEnter={canEnter} />;
}

export default function CheckUpRoute() {
  const me = useSignedIn();
  const id = readId(useParams().checkUpId);
  if (!seesChildren(me)) return <NoHouseholdCallout me={me} />;
  if (id === null) return null;
  return (
    <>
      <p className="wb-backlink">
        <Link to={paths.app.patterns.getHref()}>← Patterns</Link>
      </p>
      <CheckUpPage key={id} id={id} canEnter={canEditHousehold(me)} />
    </>
  );
}

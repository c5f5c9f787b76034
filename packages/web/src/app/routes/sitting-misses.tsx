import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { ErrorState, LoadingState } from '../../components/states';
import { paths } from '../../config/paths';
import { useAnswerKey } from '../../features/answer-keys/api/get-answer-key';
import { useLessons } from '../../features/curriculum/api/get-lessons';
import { sittingQueryOptions, useSitting } from '../../features/sittings/api/get-sitting';
import { SittingMisses } from '../../features/sittings/components/sitting-misses';
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

function Result({ id, canEdit }: { id: number; canEdit: boolean }) {
  const sitting = useSitting(id);
  const key = useAnswerKey(sitting.data?.answerKeyId ?? null);
  const lessons = useLessons(key.data?.courseId ?? null);
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
  const titles = new Map((lessons.data?.items ?? []).map((l) => [l.number, l.title]));
  return (
    <SittingMisses
      sitting={sitting.data}
      items={key.data.items}
      studentName={name}
      lessonTitle={(n) => titles.get(n)}
      canEdit={canEdit}
    />
  );
}

export default function SittingMissesRoute() {
  const me = useSignedIn();
  const id = readId(useParams().sittingId);
  if (!seesChildren(me)) return <NoHouseholdCallout me={me} />;
  if (id === null) return null;
  return (
    <>
      <p className="wb-backlink">
        <Link to={paths.app.sittings.getHref()}>← All sittings</Link>
      </p>
      <Result key={id} id={id} canEdit={canEditHousehold(me)} />
    </>
  );
}

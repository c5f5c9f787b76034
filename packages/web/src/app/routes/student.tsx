import type { QueryClient } from '@tanstack/react-query';
import { PlusIcon } from '@blueprintjs/icons';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { LinkButton } from '../../components/link-button';
import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { ErrorState, LoadingState } from '../../components/states';
import { paths } from '../../config/paths';
import { sittingsSummaryQueryOptions } from '../../features/sittings/api/get-sittings-summary';
import { StudentScores } from '../../features/sittings/components/student-scores';
import { studentQueryOptions, useStudent } from '../../features/students/api/get-student';
import { gradeLabel } from '../../features/students/types';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';
import { readId } from './route-params';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const id = readId(params.studentId);
    if (id === null) throw new Response('Not here', { status: 404 });
    const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    if (me && seesChildren(me)) {
      void queryClient.prefetchQuery(studentQueryOptions(id));
      void queryClient.prefetchQuery(sittingsSummaryQueryOptions(id));
    }
    return null;
  };

function StudentPage({ id, canEdit }: { id: number; canEdit: boolean }) {
  const student = useStudent(id);
  if (student.isPending) return <LoadingState label="Loading the student…" />;
  if (student.isError) {
    return (
      <ErrorState
        title="This student could not be loaded."
        error={student.error}
        onRetry={() => void student.refetch()}
      />
    );
  }
  const { name, gradeLevel } = student.data;
  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">{name}</h1>
          <p className="wb-muted">{gradeLabel(gradeLevel)}</p>
        </div>
        {canEdit ? (
          <LinkButton
            to={paths.app.newSitting.getHref({ studentId: id })}
            primary
            icon={<PlusIcon />}
          >
            Start a sitting
          </LinkButton>
        ) : null}
      </div>
      <section aria-labelledby="scores-title">
        <h2 id="scores-title" className="wb-subhead">
          Sitting scores
        </h2>
        <StudentScores studentId={id} studentName={name} />
      </section>
    </>
  );
}

export default function StudentRoute() {
  const me = useSignedIn();
  const id = readId(useParams().studentId);
  if (!seesChildren(me)) return <NoHouseholdCallout me={me} />;
  if (id === null) return null;
  return (
    <>
      <p className="wb-backlink">
        <Link to={paths.app.students.getHref()}>← All students</Link>
      </p>
      <StudentPage key={id} id={id} canEdit={canEditHousehold(me)} />
    </>
  );
}

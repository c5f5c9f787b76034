import { Callout } from '@blueprintjs/core';
import type { QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { ErrorState, LoadingState } from '../../components/states';
import { paths } from '../../config/paths';
import {
  answerKeysQueryOptions,
  useAnswerKeys,
} from '../../features/answer-keys/api/get-answer-keys';
import { StartSittingForm } from '../../features/sittings/components/start-sitting-form';
import { studentsQueryOptions, useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';
import { readId } from './route-params';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && seesChildren(me)) {
    void queryClient.prefetchQuery(studentsQueryOptions());
    void queryClient.prefetchQuery(answerKeysQueryOptions());
  }
  return null;
};

function NewSitting() {
  const students = useStudents();
  const keys = useAnswerKeys();
  const [search] = useSearchParams();
  if (students.isPending || keys.isPending)
    return <LoadingState label="Loading students and keys…" />;
  if (students.isError || keys.isError) {
    return (
      <ErrorState
        title="The students or keys could not be loaded."
        error={students.error ?? keys.error}
        onRetry={() => {
          void students.refetch();
          void keys.refetch();
        }}
      />
    );
  }
  if (students.data.items.length === 0 || keys.data.items.length === 0) {
    return (
      <Callout className="wb-callout" title="First a student and an answer key">
        {students.data.items.length === 0 ? (
          <p>
            Add a student on the <Link to={paths.app.students.getHref()}>Students</Link> page first.
          </p>
        ) : null}
        {keys.data.items.length === 0 ? (
          <p>
            Type in or import the answer key on the{' '}
            <Link to={paths.app.answerKeys.getHref()}>Answer keys</Link> page first.
          </p>
        ) : null}
      </Callout>
    );
  }
  return (
    <StartSittingForm
      students={students.data.items}
      keys={keys.data.items}
      defaults={{
        studentId: readId(search.get('studentId') ?? undefined) ?? undefined,
        answerKeyId: readId(search.get('answerKeyId') ?? undefined) ?? undefined,
      }}
    />
  );
}

export default function NewSittingRoute() {
  const me = useSignedIn();
  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Start a sitting</h1>
          <p className="wb-muted">
            Who did which worksheet or assessment, and when. Next you mark it item by item.
          </p>
        </div>
      </div>
      {!seesChildren(me) ? (
        <NoHouseholdCallout me={me} />
      ) : canEditHousehold(me) ? (
        <NewSitting />
      ) : (
        <Callout className="wb-callout" title="Only owners and parents start sittings">
          You can read the sittings of the students shared with you.
        </Callout>
      )}
    </>
  );
}

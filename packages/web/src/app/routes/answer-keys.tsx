import type { QueryClient } from '@tanstack/react-query';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { answerKeysQueryOptions } from '../../features/answer-keys/api/get-answer-keys';
import { KeysList } from '../../features/answer-keys/components/keys-list';
import { coursesQueryOptions, useCourses } from '../../features/curriculum/api/get-courses';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && seesChildren(me)) {
    void queryClient.prefetchQuery(answerKeysQueryOptions());
    void queryClient.prefetchQuery(coursesQueryOptions());
  }
  return null;
};

function Keys({ canEdit }: { canEdit: boolean }) {
  // Course names are a nicety for the list and a choice in the forms; the keys show without them.
  const courses = useCourses();
  return <KeysList canEdit={canEdit} courses={courses.data?.items ?? []} />;
}

export default function AnswerKeysRoute() {
  const me = useSignedIn();
  if (!seesChildren(me)) {
    return (
      <>
        <h1 className="wb-page-title">Answer keys</h1>
        <NoHouseholdCallout me={me} />
      </>
    );
  }
  return <Keys canEdit={canEditHousehold(me)} />;
}

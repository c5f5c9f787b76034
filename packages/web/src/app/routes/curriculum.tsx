import type { QueryClient } from '@tanstack/react-query';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { coursesQueryOptions } from '../../features/curriculum/api/get-courses';
import { CurriculumView } from '../../features/curriculum/components/curriculum-view';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && seesChildren(me)) void queryClient.prefetchQuery(coursesQueryOptions());
  return null;
};

export default function CurriculumRoute() {
  const me = useSignedIn();
  if (!seesChildren(me)) {
    return (
      <>
        <h1 className="wb-page-title">Curriculum</h1>
        <NoHouseholdCallout me={me} />
      </>
    );
  }
  return <CurriculumView canEdit={canEditHousehold(me)} />;
}

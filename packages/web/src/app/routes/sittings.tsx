import type { QueryClient } from '@tanstack/react-query';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { sittingsQueryOptions } from '../../features/sittings/api/get-sittings';
import { SittingsList } from '../../features/sittings/components/sittings-list';
import { studentsQueryOptions, useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && seesChildren(me)) {
    void queryClient.prefetchQuery(sittingsQueryOptions());
    void queryClient.prefetchQuery(studentsQueryOptions());
  }
  return null;
};

function Sittings({ canEdit }: { canEdit: boolean }) {
  const students = useStudents();
  const studentName = (id: number) => students.data?.items.find((s) => s.id === id)?.name ?? '…';
  return <SittingsList studentName={studentName} canEdit={canEdit} />;
}

export default function SittingsRoute() {
  const me = useSignedIn();
  if (!seesChildren(me)) {
    return (
      <>
        <h1 className="wb-page-title">Sittings</h1>
        <NoHouseholdCallout me={me} />
      </>
    );
  }
  return <Sittings canEdit={canEditHousehold(me)} />;
}

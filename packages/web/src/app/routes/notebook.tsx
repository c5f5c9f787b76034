import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { ErrorState, LoadingState } from '../../components/states';
import { WaitingList } from '../../features/drafts/components/waiting-list';
import { missesQueryOptions } from '../../features/misses/api/get-misses';
import { Notebook } from '../../features/misses/components/notebook';
import { filtersFromParams } from '../../features/misses/hooks/use-notebook-filters';
import { studentsQueryOptions, useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    if (me && seesChildren(me)) {
      const filters = filtersFromParams(new URL(request.url).searchParams);
      void queryClient.prefetchQuery(studentsQueryOptions());
      void queryClient.prefetchQuery(missesQueryOptions(filters));
    }
    return null;
  };

function NotebookBody({ canEdit, householdId }: { canEdit: boolean; householdId: number }) {
  const students = useStudents();
  if (students.isPending) return <LoadingState label="Loading the notebook…" />;
  if (students.isError) {
    return (
      <ErrorState
        title="The notebook could not be loaded."
        error={students.error}
        onRetry={() => void students.refetch()}
      />
    );
  }
  return (
    <Notebook
      students={students.data.items}
      canEdit={canEdit}
      waiting={<WaitingList householdId={householdId} />}
    />
  );
}

export default function NotebookRoute() {
  const me = useSignedIn();
  if (!seesChildren(me) || !me.household) {
    return (
      <>
        <h1 className="wb-page-title">Notebook</h1>
        <NoHouseholdCallout me={me} />
      </>
    );
  }
  return <NotebookBody canEdit={canEditHousehold(me)} householdId={me.household.id} />;
}

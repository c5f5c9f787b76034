import { Callout } from '@blueprintjs/core';
import { ShieldIcon } from '@blueprintjs/icons';
import type { QueryClient } from '@tanstack/react-query';

import { studentsQueryOptions } from '../../features/students/api/get-students';
import { StudentsList } from '../../features/students/components/students-list';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  // Warm the cache only; the page shows loading and error states itself.
  if (me?.household && !me.user.isAdmin) void queryClient.prefetchQuery(studentsQueryOptions());
  return null;
};

export default function StudentsRoute() {
  const me = useSignedIn();
  if (me.user.isAdmin || !me.household) {
    return (
      <>
        <h1 className="wb-page-title">Students</h1>
        <Callout
          icon={<ShieldIcon />}
          title={me.user.isAdmin ? 'Site admins see no children’s data' : 'No household yet'}
          className="wb-callout"
        >
          {me.user.isAdmin
            ? 'You are signed in as the site admin. Households keep their children to themselves, so there is nothing to list here.'
            : 'You are not part of a household yet. Ask the family who invited you to send the invitation again.'}
        </Callout>
      </>
    );
  }
  return <StudentsList canEdit={canEditHousehold(me)} />;
}

import { Callout } from '@blueprintjs/core';
import { ShieldIcon } from '@blueprintjs/icons';
import type { QueryClient } from '@tanstack/react-query';
import { Role } from '@workback/core';

import { ErrorState, LoadingState } from '../../components/states';
import { invitationsQueryOptions } from '../../features/members/api/get-invitations';
import { membersQueryOptions } from '../../features/members/api/get-members';
import { MembersView } from '../../features/members/components/members-view';
import { studentsQueryOptions, useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn, type Me } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && canEditHousehold(me)) {
    void queryClient.prefetchQuery(membersQueryOptions());
    void queryClient.prefetchQuery(invitationsQueryOptions());
    void queryClient.prefetchQuery(studentsQueryOptions());
  }
  return null;
};

function ManageMembers({ me }: { me: Me }) {
  const students = useStudents();
  if (students.isPending) return <LoadingState label="Loading members…" />;
  if (students.isError) {
    return (
      <ErrorState
        title="The members could not be loaded."
        error={students.error}
        onRetry={() => void students.refetch()}
      />
    );
  }
  return (
    <MembersView
      householdName={me.household?.name ?? ''}
      viewerIsOwner={me.household?.role === Role.owner}
      students={students.data.items.map(({ id, name }) => ({ id, name }))}
    />
  );
}

export default function MembersRoute() {
  const me = useSignedIn();
  if (me.user.isAdmin || !me.household) {
    return (
      <>
        <h1 className="wb-page-title">Members</h1>
        <Callout icon={<ShieldIcon />} title="No household to manage" className="wb-callout">
          {me.user.isAdmin
            ? 'You are signed in as the site admin. Households manage their own members.'
            : 'You are not part of a household yet. Ask the family who invited you to send the invitation again.'}
        </Callout>
      </>
    );
  }
  if (!canEditHousehold(me)) {
    return (
      <>
        <h1 className="wb-page-title">Members</h1>
        <Callout
          icon={<ShieldIcon />}
          title="Owners and parents manage members"
          className="wb-callout"
        >
          As a tutor you look over the children shared with you. Ask the family if you need access
          to another child.
        </Callout>
      </>
    );
  }
  return <ManageMembers me={me} />;
}

import { Callout, Classes } from '@blueprintjs/core';
import { PeopleIcon } from '@blueprintjs/icons';
import type { QueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { EmptyState, ErrorState, LoadingState } from '../../components/states';
import { paths } from '../../config/paths';
import { useOffline } from '../../features/drafts/components/offline-banner';
import { WaitingList } from '../../features/drafts/components/waiting-list';
import { keepDraft, photosOf } from '../../features/drafts/drafts-store';
import { LogMissForm, type OfflineMiss } from '../../features/misses/components/log-miss-form';
import { studentsQueryOptions, useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn, type Me } from '../../lib/auth';
import { keptStudents } from '../../lib/kept-me';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && seesChildren(me) && !me.offline) void queryClient.prefetchQuery(studentsQueryOptions());
  return null;
};

function LogMissBody({ me, householdId }: { me: Me; householdId: number }) {
  const students = useStudents();
  const offline = useOffline(me);
  // With no connection, the children's names kept on this phone the last time (kept-me.ts).
  const kept = offline && !students.isSuccess ? keptStudents(householdId) : null;
  if (offline && !students.isSuccess && !kept) {
    return (
      <>
        <WaitingList householdId={householdId} />
        <Callout className="wb-callout" title="The form needs the children’s names">
          This phone has not kept them yet. Open Log a miss once with a connection; after that it
          works offline too.
        </Callout>
      </>
    );
  }
  if (students.isPending && !kept) return <LoadingState label="Loading students…" />;
  if (students.isError && !kept) {
    return (
      <ErrorState
        title="The students could not be loaded."
        error={students.error}
        onRetry={() => void students.refetch()}
      />
    );
  }
  const list = kept ?? students.data?.items ?? [];
  if (list.length === 0) {
    return (
      <EmptyState
        icon={<PeopleIcon size={40} />}
        title="Add a student first, then log the problems they missed."
        action={
          <Link
            className={`${Classes.BUTTON} ${Classes.INTENT_PRIMARY}`}
            to={paths.app.students.getHref()}
          >
            Go to Students
          </Link>
        }
      />
    );
  }
  const keepOffline = async (miss: OfflineMiss) =>
    keepDraft({
      key: miss.key,
      householdId,
      path: '/misses',
      fields: miss.fields,
      photos: await photosOf(miss.photos),
      title: miss.title,
      detail: miss.detail,
      keptAt: new Date().toISOString(),
      refusal: null,
    });
  return (
    <>
      <WaitingList householdId={householdId} />
      <LogMissForm students={list} householdId={householdId} keepOffline={keepOffline} />
    </>
  );
}

export default function LogMissRoute() {
  const me = useSignedIn();
  let body;
  if (!seesChildren(me) || !me.household) {
    body = <NoHouseholdCallout me={me} />;
  } else if (!canEditHousehold(me)) {
    body = (
      <Callout className="wb-callout" title="The family logs the misses">
        As a tutor you can open any miss in the{' '}
        <Link to={paths.app.notebook.getHref()}>notebook</Link> to place pins on the photos and add
        notes.
      </Callout>
    );
  } else {
    body = <LogMissBody me={me} householdId={me.household.id} />;
  }
  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Log a miss</h1>
          <p className="wb-muted">
            One missed problem at a time: what was asked, what your child wrote, and what they said
            when you asked how they solved it.
          </p>
        </div>
      </div>
      {body}
    </>
  );
}

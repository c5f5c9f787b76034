import { Classes } from '@blueprintjs/core';
import { Link } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { ErrorState, LoadingState } from '../../components/states';
import { paths } from '../../config/paths';
import { useOffline } from '../../features/drafts/components/offline-banner';
import { WaitingList } from '../../features/drafts/components/waiting-list';
import { Notebook } from '../../features/misses/components/notebook';
import { useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, useSignedIn, type Me } from '../../lib/auth';

// Its data is asked for by notebook-loader.ts, in the app's first file.

/** With no connection: the misses are on the server, but what waits on the phone is here. */
function OfflineNotebook({ canEdit, householdId }: { canEdit: boolean; householdId: number }) {
  return (
    <>
      <h1 className="wb-page-title">Notebook</h1>
      <WaitingList householdId={householdId} />
      <p className="wb-muted">The notebook’s misses show again when the connection returns.</p>
      {canEdit ? (
        <Link
          className={`${Classes.BUTTON} ${Classes.INTENT_PRIMARY}`}
          to={paths.app.logMiss.getHref()}
        >
          Log a miss
        </Link>
      ) : null}
    </>
  );
}

function NotebookBody({ me, householdId }: { me: Me; householdId: number }) {
  const students = useStudents();
  const offline = useOffline(me);
  const canEdit = canEditHousehold(me);
  if (offline && !students.isSuccess) {
    return <OfflineNotebook canEdit={canEdit} householdId={householdId} />;
  }
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
  return <NotebookBody me={me} householdId={me.household.id} />;
}

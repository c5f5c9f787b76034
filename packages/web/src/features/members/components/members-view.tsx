import { Button, Callout, Intent } from '@blueprintjs/core';
import { NewPersonIcon, ShieldIcon } from '@blueprintjs/icons';
import { useState } from 'react';

import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { useInvitations } from '../api/get-invitations';
import { useMembers } from '../api/get-members';
import type { Member, StudentRef } from '../types';
import { InviteDialog } from './invite-dialog';
import { MemberAccessDialog } from './member-access-dialog';
import { MemberCards } from './member-cards';
import { PendingInvitations } from './pending-invitations';
import { RemoveMemberAlert } from './remove-member-alert';

import '../members.css';

type MembersViewProps = {
  householdName: string;
  viewerIsOwner: boolean;
  students: readonly StudentRef[];
};

/** The Members page body (owners and parents): who is in, who is invited, and their access. */
export function MembersView({ householdName, viewerIsOwner, students }: MembersViewProps) {
  const members = useMembers();
  const invitations = useInvitations();
  const [inviting, setInviting] = useState(false);
  const [changing, setChanging] = useState<Member | null>(null);
  const [removing, setRemoving] = useState<Member | null>(null);

  let people;
  if (members.isPending) {
    people = <LoadingState label="Loading members…" />;
  } else if (members.isError) {
    people = (
      <ErrorState
        title="The members could not be loaded."
        error={members.error}
        onRetry={() => void members.refetch()}
      />
    );
  } else {
    people = (
      <MemberCards
        members={members.data.items}
        students={students}
        viewerIsOwner={viewerIsOwner}
        onChange={setChanging}
        onRemove={setRemoving}
      />
    );
  }

  let waiting;
  if (invitations.isPending) {
    waiting = <LoadingState label="Loading invitations…" />;
  } else if (invitations.isError) {
    waiting = (
      <ErrorState
        title="The invitations could not be loaded."
        error={invitations.error}
        onRetry={() => void invitations.refetch()}
      />
    );
  } else if (invitations.data.items.length === 0) {
    waiting = (
      <EmptyState title="No invitations waiting. Invite a tutor or a second parent to share the notebook." />
    );
  } else {
    waiting = <PendingInvitations invitations={invitations.data.items} students={students} />;
  }

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Members</h1>
          <p className="wb-muted">
            The people who share {householdName}’s notebook. Owners and parents see everything; a
            tutor sees only the children you choose.
          </p>
        </div>
        <Button intent={Intent.PRIMARY} icon={<NewPersonIcon />} onClick={() => setInviting(true)}>
          Invite someone
        </Button>
      </div>
      <Callout icon={<ShieldIcon />} className="wb-callout wb-members-caution">
        A tutor sees the misses, photos, explanations and review plans of the children you tick, and
        can add notes and build plans. Invite only people you trust with your children’s work;
        removing someone takes effect on their next click.
      </Callout>
      <section className="wb-members-section" aria-labelledby="members-people">
        <h2 id="members-people" className="wb-section-title">
          People in {householdName}
        </h2>
        {people}
      </section>
      <section className="wb-members-section" aria-labelledby="members-invited">
        <h2 id="members-invited" className="wb-section-title">
          Invitations waiting
        </h2>
        {waiting}
      </section>
      <InviteDialog open={inviting} students={students} onClose={() => setInviting(false)} />
      <MemberAccessDialog
        member={changing}
        students={students}
        viewerIsOwner={viewerIsOwner}
        onClose={() => setChanging(null)}
      />
      <RemoveMemberAlert
        member={removing}
        householdName={householdName}
        onClose={() => setRemoving(null)}
      />
    </>
  );
}

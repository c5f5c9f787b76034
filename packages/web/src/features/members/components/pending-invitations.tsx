import { Button, Card, Intent, Tag } from '@blueprintjs/core';
import { CrossIcon, EnvelopeIcon } from '@blueprintjs/icons';
import { Role } from '@workback/core';

import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABEL } from '../../../lib/auth';
import { useWithdrawInvitation } from '../api/withdraw-invitation';
import { formatDay, studentNames, type Invitation, type StudentRef } from '../types';

function InvitationCard({
  invitation,
  students,
}: {
  invitation: Invitation;
  students: readonly StudentRef[];
}) {
  const toast = useToast();
  const withdraw = useWithdrawInvitation();
  const expired = invitation.status === 'expired';
  return (
    <Card className="wb-card wb-member-card">
      <div className="wb-card-main">
        <span className="wb-card-title wb-invitation-email">
          <EnvelopeIcon aria-hidden /> {invitation.email}
        </span>
        <span className="wb-member-meta">
          <Tag minimal round className={`wb-role-tag wb-role-${invitation.role}`}>
            {ROLE_LABEL[invitation.role]}
          </Tag>
          <span className="wb-muted">
            {invitation.role === Role.tutor
              ? `Would see ${studentNames(invitation.studentIds, students)}`
              : 'Would see every child'}
          </span>
        </span>
        <span className="wb-muted">
          {invitation.invitedBy ? `Sent by ${invitation.invitedBy.displayName} · ` : ''}
          {expired
            ? `Expired on ${formatDay(invitation.expiresAt)} — invite them again for a new link`
            : `The link works until ${formatDay(invitation.expiresAt)}`}
        </span>
      </div>
      <Button
        size="small"
        variant="minimal"
        icon={<CrossIcon />}
        loading={withdraw.isPending}
        aria-label={`${expired ? 'Remove' : 'Withdraw'} the invitation to ${invitation.email}`}
        onClick={() =>
          withdraw.mutate(invitation.id, {
            onSuccess: () =>
              toast(
                expired
                  ? `Removed the expired invitation to ${invitation.email}.`
                  : `Withdrew the invitation to ${invitation.email}. Its link no longer works.`,
              ),
            onError: (error) =>
              toast(
                isApiError(error)
                  ? `Not withdrawn: ${error.message}`
                  : 'The invitation could not be withdrawn. Please try again.',
                Intent.WARNING,
              ),
          })
        }
      >
        {expired ? 'Remove' : 'Withdraw'}
      </Button>
    </Card>
  );
}

/** Invitations sent but not accepted yet, with a way to take each back. */
export function PendingInvitations({
  invitations,
  students,
}: {
  invitations: readonly Invitation[];
  students: readonly StudentRef[];
}) {
  return (
    <ul className="wb-cards" aria-label="Invitations waiting">
      {invitations.map((invitation) => (
        <li key={invitation.id}>
          <InvitationCard invitation={invitation} students={students} />
        </li>
      ))}
    </ul>
  );
}

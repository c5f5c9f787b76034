import { Alert, Callout, Intent } from '@blueprintjs/core';
import { BlockedPersonIcon } from '@blueprintjs/icons';
import { useState } from 'react';

import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { useRemoveMember } from '../api/remove-member';
import type { Member } from '../types';

/** Asks before revoking; a refusal (the last owner, a parent and the owner) stays on screen. */
export function RemoveMemberAlert({
  member,
  householdName,
  onClose,
}: {
  member: Member | null;
  householdName: string;
  onClose: () => void;
}) {
  const toast = useToast();
  const remove = useRemoveMember();
  const [refusal, setRefusal] = useState<string | null>(null);
  const close = () => {
    setRefusal(null);
    onClose();
  };
  return (
    <Alert
      isOpen={member !== null}
      intent={refusal ? Intent.NONE : Intent.DANGER}
      icon={<BlockedPersonIcon />}
      cancelButtonText={refusal ? undefined : 'Keep access'}
      confirmButtonText={refusal ? 'Close' : 'Remove access'}
      loading={remove.isPending}
      onCancel={close}
      onConfirm={() => {
        if (!member || refusal) {
          close();
          return;
        }
        remove.mutate(member.id, {
          onSuccess: () => {
            toast(`${member.displayName} no longer has access to ${householdName}.`);
            close();
          },
          onError: (error) =>
            setRefusal(
              isApiError(error) ? error.message : 'Access could not be removed. Please try again.',
            ),
        });
      }}
    >
      {member ? (
        <p>
          Remove <strong>{member.displayName}</strong> ({member.email}) from {householdName}? From
          their next click they see nothing of this household. Their account stays, and you can
          invite them again later.
        </p>
      ) : null}
      {refusal ? (
        <Callout intent={Intent.WARNING} role="alert" className="wb-form-error" title="Not removed">
          {refusal}
        </Callout>
      ) : null}
    </Alert>
  );
}

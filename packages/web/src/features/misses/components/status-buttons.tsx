import { Button, ButtonGroup, Intent } from '@blueprintjs/core';
import { MISS_STATUSES, type MissStatus } from '@workback/core';

import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { useUpdateMiss } from '../api/update-miss';
import { statusLabel } from '../types';

/** logged → discussed → planned → resolved, one tap each; tutors see where it stands. */
export function StatusButtons({
  missId,
  status,
  canEdit,
}: {
  missId: number;
  status: MissStatus;
  canEdit: boolean;
}) {
  const toast = useToast();
  const update = useUpdateMiss();
  if (!canEdit) {
    return (
      <p>
        <strong>{statusLabel(status)}</strong>{' '}
        <span className="wb-muted">(the family moves a miss along)</span>
      </p>
    );
  }
  return (
    <ButtonGroup className="wb-status-buttons" role="group" aria-label="Where this miss stands">
      {MISS_STATUSES.map((value) => (
        <Button
          key={value}
          active={value === status}
          aria-pressed={value === status}
          intent={value === status ? Intent.PRIMARY : Intent.NONE}
          variant={value === status ? 'solid' : 'outlined'}
          loading={update.isPending && update.variables?.status === value}
          onClick={() => {
            if (value === status) return;
            update.mutate(
              { id: missId, status: value },
              {
                onSuccess: () => toast(`Marked “${statusLabel(value)}”.`),
                onError: (e) =>
                  toast(
                    isApiError(e) ? e.message : 'The status could not be changed.',
                    Intent.WARNING,
                  ),
              },
            );
          }}
        >
          {statusLabel(value)}
        </Button>
      ))}
    </ButtonGroup>
  );
}

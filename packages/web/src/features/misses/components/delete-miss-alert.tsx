import { Alert, Intent } from '@blueprintjs/core';
import { TrashIcon } from '@blueprintjs/icons';

import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { useDeleteMiss } from '../api/delete-miss';

/** Asks before deleting: the photos, pins and notes go with the miss. */
export function DeleteMissAlert({
  missId,
  open,
  onClose,
  onDeleted,
}: {
  missId: number;
  open: boolean;
  onClose: () => void;
  onDeleted: () => void;
}) {
  const toast = useToast();
  const remove = useDeleteMiss();
  return (
    <Alert
      isOpen={open}
      intent={Intent.DANGER}
      icon={<TrashIcon />}
      cancelButtonText="Keep"
      confirmButtonText="Delete"
      loading={remove.isPending}
      onCancel={onClose}
      onConfirm={() =>
        remove.mutate(missId, {
          onSuccess: () => {
            toast('Deleted the miss.');
            onDeleted();
          },
          onError: (error) => {
            toast(
              isApiError(error)
                ? `Could not delete it: ${error.message}`
                : 'Could not delete the miss.',
              Intent.WARNING,
            );
            onClose();
          },
        })
      }
    >
      <p>Delete this miss? Its photos, pins and notes go too. This cannot be undone.</p>
    </Alert>
  );
}

import { Alert, Intent } from '@blueprintjs/core';
import { TrashIcon } from '@blueprintjs/icons';

import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { useDeleteStudent } from '../api/delete-student';
import type { Student } from '../types';

/** Asks before deleting: a child's whole record goes with them. */
export function DeleteStudentAlert({
  student,
  onClose,
}: {
  student: Student | null;
  onClose: () => void;
}) {
  const toast = useToast();
  const remove = useDeleteStudent();
  return (
    <Alert
      isOpen={student !== null}
      intent={Intent.DANGER}
      icon={<TrashIcon />}
      cancelButtonText="Keep"
      confirmButtonText="Delete"
      loading={remove.isPending}
      onCancel={onClose}
      onConfirm={() => {
        if (!student) return;
        remove.mutate(student.id, {
          onSuccess: () => {
            toast(`Deleted ${student.name}.`);
            onClose();
          },
          onError: (error) => {
            toast(
              isApiError(error)
                ? `Could not delete ${student.name}: ${error.message}`
                : `Could not delete ${student.name}.`,
              Intent.WARNING,
            );
            onClose();
          },
        });
      }}
    >
      {student ? (
        <p>
          Delete <strong>{student.name}</strong>? Everything logged for {student.name} goes too.
          This cannot be undone.
        </p>
      ) : null}
    </Alert>
  );
}

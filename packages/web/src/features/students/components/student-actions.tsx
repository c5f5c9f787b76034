import { Button } from '@blueprintjs/core';
import { EditIcon, TrashIcon } from '@blueprintjs/icons';

import type { Student } from '../types';

export type StudentActionHandlers = {
  onEdit: (student: Student) => void;
  onDelete: (student: Student) => void;
};

export function StudentActions({
  student,
  onEdit,
  onDelete,
}: { student: Student } & StudentActionHandlers) {
  return (
    <span className="wb-row-actions">
      <Button
        size="small"
        variant="minimal"
        icon={<EditIcon />}
        onClick={() => onEdit(student)}
        aria-label={`Edit ${student.name}`}
      >
        Edit
      </Button>
      <Button
        size="small"
        variant="minimal"
        icon={<TrashIcon />}
        onClick={() => onDelete(student)}
        aria-label={`Delete ${student.name}`}
      >
        Delete
      </Button>
    </span>
  );
}

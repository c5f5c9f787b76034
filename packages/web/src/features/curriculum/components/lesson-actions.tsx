import { Button } from '@blueprintjs/core';
import { EditIcon, TrashIcon } from '@blueprintjs/icons';

import type { Lesson } from '../types';

export type LessonActionHandlers = {
  onEdit: (lesson: Lesson) => void;
  onDelete: (lesson: Lesson) => void;
};

export function LessonActions({
  lesson,
  onEdit,
  onDelete,
}: { lesson: Lesson } & LessonActionHandlers) {
  return (
    <span className="wb-row-actions">
      <Button
        size="small"
        variant="minimal"
        icon={<EditIcon />}
        onClick={() => onEdit(lesson)}
        aria-label={`Edit lesson ${lesson.number}`}
      >
        Edit
      </Button>
      <Button
        size="small"
        variant="minimal"
        icon={<TrashIcon />}
        onClick={() => onDelete(lesson)}
        aria-label={`Delete lesson ${lesson.number}`}
      >
        Delete
      </Button>
    </span>
  );
}

import { Button } from '@blueprintjs/core';
import { EditIcon, TrashIcon } from '@blueprintjs/icons';

/** What a list does when one of its rows is to be edited or deleted. */
export type RowActionHandlers<T> = {
  onEdit: (row: T) => void;
  onDelete: (row: T) => void;
};

/**
 * Edit and Delete for one row of a list; `name` ends each button's accessible name,
 * so `name="lesson 3"` gives "Edit lesson 3" and "Delete lesson 3".
 */
export function RowActions<T>({
  row,
  name,
  onEdit,
  onDelete,
}: { row: T; name: string } & RowActionHandlers<T>) {
  return (
    <span className="wb-row-actions">
      <Button
        size="small"
        variant="minimal"
        icon={<EditIcon />}
        onClick={() => onEdit(row)}
        aria-label={`Edit ${name}`}
      >
        Edit
      </Button>
      <Button
        size="small"
        variant="minimal"
        icon={<TrashIcon />}
        onClick={() => onDelete(row)}
        aria-label={`Delete ${name}`}
      >
        Delete
      </Button>
    </span>
  );
}

import { Button, Intent } from '@blueprintjs/core';
import { PeopleIcon, PlusIcon } from '@blueprintjs/icons';
import { lazy, Suspense, useMemo, useState } from 'react';

import { useTableFits } from '../../../components/table-fits';
import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { useStudents } from '../api/get-students';
import type { Student } from '../types';
import { DeleteStudentAlert } from './delete-student-alert';
import { StudentCards } from './student-cards';
import { StudentDialog } from './student-dialog';

// Wide screens only: a phone shows cards and never downloads the table component.
const StudentsTable = lazy(() =>
  import('./students-table').then((m) => ({ default: m.StudentsTable })),
);

type Editing = { open: boolean; student: Student | null };

/** The Students page body: the list, and for owners and parents the add/edit/delete actions. */
export function StudentsList({ canEdit }: { canEdit: boolean }) {
  const students = useStudents();
  const tableFits = useTableFits();
  const [editing, setEditing] = useState<Editing>({ open: false, student: null });
  const [deleting, setDeleting] = useState<Student | null>(null);

  const actions = useMemo(
    () =>
      canEdit
        ? {
            onEdit: (student: Student) => setEditing({ open: true, student }),
            onDelete: (student: Student) => setDeleting(student),
          }
        : undefined,
    [canEdit],
  );

  const addButton = canEdit ? (
    <Button
      intent={Intent.PRIMARY}
      icon={<PlusIcon />}
      onClick={() => setEditing({ open: true, student: null })}
    >
      Add a student
    </Button>
  ) : null;

  let body;
  if (students.isPending) {
    body = <LoadingState label="Loading students…" />;
  } else if (students.isError) {
    body = (
      <ErrorState
        title="The students could not be loaded."
        error={students.error}
        onRetry={() => void students.refetch()}
      />
    );
  } else if (students.data.items.length === 0) {
    body = canEdit ? (
      <EmptyState
        icon={<PeopleIcon size={40} />}
        title="No students yet. Add your first child to start a notebook."
        action={addButton}
      />
    ) : (
      <EmptyState
        icon={<PeopleIcon size={40} />}
        title="No students are shared with you yet. Ask the family to give you access."
      />
    );
  } else if (!tableFits) {
    body = <StudentCards students={students.data.items} actions={actions} />;
  } else {
    body = (
      <Suspense fallback={<LoadingState label="Loading students…" />}>
        <StudentsTable students={students.data.items} actions={actions} />
      </Suspense>
    );
  }

  const hasStudents = students.isSuccess && students.data.items.length > 0;

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Students</h1>
          <p className="wb-muted">
            {canEdit
              ? 'The children whose math you look over. A first name or nickname and a grade is all we keep.'
              : 'The children this household has shared with you. Only owners and parents can change them.'}
          </p>
        </div>
        {hasStudents ? addButton : null}
      </div>
      {body}
      <StudentDialog
        open={editing.open}
        student={editing.student}
        onClose={() => setEditing((current) => ({ ...current, open: false }))}
      />
      <DeleteStudentAlert student={deleting} onClose={() => setDeleting(null)} />
    </>
  );
}

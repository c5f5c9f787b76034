import { Cell, Column, SelectionModes, Table2 } from '@blueprintjs/table';

import { formatAdded, gradeLabel, type Student } from '../types';
import { StudentActions, type StudentActionHandlers } from './student-actions';

const ROW_HEIGHT = 44;

/** The students of the household as a table (wide screens). */
export function StudentsTable({
  students,
  actions,
}: {
  students: readonly Student[];
  /** Leave out for read-only viewers (tutors). */
  actions?: StudentActionHandlers;
}) {
  const columns = [
    <Column
      key="name"
      name="Name"
      cellRenderer={(row) => <Cell className="wb-cell-strong">{students[row]?.name}</Cell>}
    />,
    <Column
      key="grade"
      name="Grade"
      cellRenderer={(row) => <Cell>{gradeLabel(students[row]?.gradeLevel ?? '')}</Cell>}
    />,
    <Column
      key="added"
      name="Added"
      cellRenderer={(row) => <Cell>{formatAdded(students[row]?.createdAt ?? '')}</Cell>}
    />,
  ];
  if (actions) {
    columns.push(
      <Column
        key="actions"
        name="Actions"
        cellRenderer={(row) => {
          const student = students[row];
          return (
            <Cell interactive className="wb-cell-actions">
              {student ? <StudentActions student={student} {...actions} /> : null}
            </Cell>
          );
        }}
      />,
    );
  }
  return (
    <div
      className="wb-table"
      style={{ height: (students.length + 1) * ROW_HEIGHT + 2 }}
      aria-label="Students"
      role="region"
    >
      <Table2
        numRows={students.length}
        defaultRowHeight={ROW_HEIGHT}
        columnWidths={actions ? [260, 160, 150, 200] : [300, 180, 170]}
        enableRowHeader={false}
        enableFocusedCell={false}
        enableColumnResizing={false}
        enableRowResizing={false}
        enableGhostCells={false}
        selectionModes={SelectionModes.NONE}
        cellRendererDependencies={[students, actions]}
      >
        {columns}
      </Table2>
    </div>
  );
}

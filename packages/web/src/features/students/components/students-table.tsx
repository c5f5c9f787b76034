import { Cell, Column, SelectionModes, Table2 } from '@blueprintjs/table';
import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { formatAdded, gradeLabel, type Student } from '../types';
import { StudentActions, type StudentActionHandlers } from './student-actions';

const ROW_HEIGHT = 44;
const HEADER_HEIGHT = 30;
const WIDTHS = { name: 240, grade: 150, added: 140, actions: 190 };

/** Below this width the table would scroll sideways, so the list shows cards instead. */
export const TABLE_FITS_QUERY = '(min-width: 1041px)';

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
      cellRenderer={(row) => {
        const student = students[row];
        return (
          <Cell interactive className="wb-cell-strong">
            {student ? (
              <Link to={paths.app.student.getHref(student.id)}>{student.name}</Link>
            ) : null}
          </Cell>
        );
      }}
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
  const columnWidths = actions
    ? [WIDTHS.name, WIDTHS.grade, WIDTHS.added, WIDTHS.actions]
    : [WIDTHS.name, WIDTHS.grade, WIDTHS.added];
  const width = columnWidths.reduce((sum, w) => sum + w, 0);
  return (
    <div
      className="wb-table"
      style={{ height: HEADER_HEIGHT + students.length * ROW_HEIGHT + 2, width: width + 2 }}
      aria-label="Students"
      role="region"
    >
      <Table2
        numRows={students.length}
        defaultRowHeight={ROW_HEIGHT}
        columnWidths={columnWidths}
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

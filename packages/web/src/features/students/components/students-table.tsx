import { Cell, Column } from '@blueprintjs/table';
import { Link } from 'react-router-dom';

import { actionsColumn, ListTable } from '../../../components/list-table';
import { paths } from '../../../config/paths';
import { formatAdded, gradeLabel, type Student } from '../types';
import { StudentActions, type StudentActionHandlers } from './student-actions';

const ROW_HEIGHT = 44;
const WIDTHS = { name: 240, grade: 150, added: 140, actions: 190 };

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
      actionsColumn(students, (student) => <StudentActions student={student} {...actions} />),
    );
  }
  const columnWidths = actions
    ? [WIDTHS.name, WIDTHS.grade, WIDTHS.added, WIDTHS.actions]
    : [WIDTHS.name, WIDTHS.grade, WIDTHS.added];
  return (
    <ListTable
      label="Students"
      numRows={students.length}
      rowHeight={ROW_HEIGHT}
      columnWidths={columnWidths}
      dependencies={[students, actions]}
    >
      {columns}
    </ListTable>
  );
}

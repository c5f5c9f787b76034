import { Card } from '@blueprintjs/core';
import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { formatAdded, gradeLabel, type Student } from '../types';
import { StudentActions, type StudentActionHandlers } from './student-actions';

/** The same students as cards, for phones (a table does not fit 390 px). */
export function StudentCards({
  students,
  actions,
}: {
  students: readonly Student[];
  actions?: StudentActionHandlers;
}) {
  return (
    <ul className="wb-cards" aria-label="Students">
      {students.map((student) => (
        <li key={student.id}>
          <Card className="wb-card">
            <div className="wb-card-main">
              <Link className="wb-card-title" to={paths.app.student.getHref(student.id)}>
                {student.name}
              </Link>
              <span className="wb-muted">
                {gradeLabel(student.gradeLevel)} · added {formatAdded(student.createdAt)}
              </span>
            </div>
            {actions ? <StudentActions student={student} {...actions} /> : null}
          </Card>
        </li>
      ))}
    </ul>
  );
}

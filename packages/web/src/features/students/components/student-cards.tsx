import { Card } from '@blueprintjs/core';

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
              <span className="wb-card-title">{student.name}</span>
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

import { RowActions, type RowActionHandlers } from '../../../components/row-actions';
import type { Student } from '../types';

export type StudentActionHandlers = RowActionHandlers<Student>;

export function StudentActions({
  student,
  ...handlers
}: { student: Student } & StudentActionHandlers) {
  return <RowActions row={student} name={student.name} {...handlers} />;
}

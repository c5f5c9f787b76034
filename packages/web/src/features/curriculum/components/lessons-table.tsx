import { Cell, Column } from '@blueprintjs/table';

import { actionsColumn, ListTable } from '../../../components/list-table';
import type { Lesson } from '../types';
import { LessonActions, type LessonActionHandlers } from './lesson-actions';

const ROW_HEIGHT = 40;
const WIDTHS = { number: 56, title: 300, skills: 240, actions: 160 };

/** Wider than the other lists' tables, so lessons turn to cards on narrower screens. */
export const LESSONS_TABLE_FITS_QUERY = '(min-width: 1180px)';

export function LessonsTable({
  courseName,
  lessons,
  actions,
}: {
  courseName: string;
  lessons: readonly Lesson[];
  actions?: LessonActionHandlers;
}) {
  const columns = [
    <Column
      key="number"
      name="No."
      cellRenderer={(row) => <Cell className="wb-cell-strong">{lessons[row]?.number}</Cell>}
    />,
    <Column
      key="title"
      name="Title"
      cellRenderer={(row) => <Cell tooltip={lessons[row]?.title}>{lessons[row]?.title}</Cell>}
    />,
    <Column
      key="skills"
      name="Skills"
      cellRenderer={(row) => (
        <Cell className="wb-muted">{lessons[row]?.skills.join(', ') || '—'}</Cell>
      )}
    />,
  ];
  if (actions) {
    columns.push(
      actionsColumn(lessons, (lesson) => <LessonActions lesson={lesson} {...actions} />),
    );
  }
  const columnWidths = actions
    ? [WIDTHS.number, WIDTHS.title, WIDTHS.skills, WIDTHS.actions]
    : [WIDTHS.number, WIDTHS.title + 80, WIDTHS.skills + 80];
  return (
    <ListTable
      label={`Lessons of ${courseName}`}
      numRows={lessons.length}
      rowHeight={ROW_HEIGHT}
      columnWidths={columnWidths}
      dependencies={[lessons, actions]}
    >
      {columns}
    </ListTable>
  );
}

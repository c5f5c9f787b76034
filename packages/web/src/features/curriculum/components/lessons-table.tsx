import { Cell, Column, SelectionModes, Table2 } from '@blueprintjs/table';

import type { Lesson } from '../types';
import { LessonActions, type LessonActionHandlers } from './lesson-actions';

const ROW_HEIGHT = 40;
const HEADER_HEIGHT = 30;
const WIDTHS = { number: 56, title: 300, skills: 240, actions: 160 };

/** Below this width the table would scroll sideways, so lessons show as cards instead. */
export const TABLE_FITS_QUERY = '(min-width: 1180px)';

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
      <Column
        key="actions"
        name="Actions"
        cellRenderer={(row) => {
          const lesson = lessons[row];
          return (
            <Cell interactive className="wb-cell-actions">
              {lesson ? <LessonActions lesson={lesson} {...actions} /> : null}
            </Cell>
          );
        }}
      />,
    );
  }
  const columnWidths = actions
    ? [WIDTHS.number, WIDTHS.title, WIDTHS.skills, WIDTHS.actions]
    : [WIDTHS.number, WIDTHS.title + 80, WIDTHS.skills + 80];
  const width = columnWidths.reduce((sum, w) => sum + w, 0);
  return (
    <div
      className="wb-table"
      style={{ height: HEADER_HEIGHT + lessons.length * ROW_HEIGHT + 2, width: width + 2 }}
      aria-label={`Lessons of ${courseName}`}
      role="region"
    >
      <Table2
        numRows={lessons.length}
        defaultRowHeight={ROW_HEIGHT}
        columnWidths={columnWidths}
        enableRowHeader={false}
        enableFocusedCell={false}
        enableColumnResizing={false}
        enableRowResizing={false}
        enableGhostCells={false}
        selectionModes={SelectionModes.NONE}
        cellRendererDependencies={[lessons, actions]}
      >
        {columns}
      </Table2>
    </div>
  );
}

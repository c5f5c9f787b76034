import { Cell, Column } from '@blueprintjs/table';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';

import { ListTable } from '../../../components/list-table';
import { paths } from '../../../config/paths';
import {
  causeLabel,
  formatDay,
  ruleTitle,
  shownRule,
  smallPhotoUrl,
  statusLabel,
  type MissSummary,
} from '../types';
import { kindText } from './word-problem';

const ROW_HEIGHT = 56;
// Photo, student, date, problem, answer, kind, cause, step error, status: 918 px, as before the kind.
const WIDTHS = [64, 76, 104, 136, 68, 112, 104, 136, 118];

/** The misses as a table (wide screens); a click anywhere on a row opens the miss. */
export function NotebookTable({
  misses,
  studentName,
}: {
  misses: readonly MissSummary[];
  studentName: (id: number) => string;
}) {
  const navigate = useNavigate();
  // The rule the list is filtered by, so each row names that rule (see shownRule).
  const filterRule = useSearchParams()[0].get('rule');
  const open = (row: number) => {
    const miss = misses[row];
    if (miss) void navigate(paths.app.miss.getHref(miss.id));
  };
  const cell = (row: number, content: React.ReactNode, className?: string, tooltip?: string) => (
    <Cell interactive className={className} tooltip={tooltip}>
      <div className="wb-row-hit" onClick={() => open(row)}>
        {content}
      </div>
    </Cell>
  );
  const columns = [
    <Column
      key="photo"
      name="Photo"
      cellRenderer={(row) => {
        const miss = misses[row];
        return cell(
          row,
          miss?.thumbnailPhotoId ? (
            <img
              className="wb-thumb"
              src={smallPhotoUrl(miss.thumbnailPhotoId)}
              width={44}
              height={44}
              alt=""
              loading="lazy"
              decoding="async"
            />
          ) : (
            <span className="wb-thumb wb-thumb-none" aria-hidden="true" />
          ),
        );
      }}
    />,
    <Column
      key="student"
      name="Student"
      cellRenderer={(row) => cell(row, studentName(misses[row]?.studentId ?? 0))}
    />,
    <Column
      key="date"
      name="Date"
      cellRenderer={(row) => cell(row, formatDay(misses[row]?.occurredOn ?? ''))}
    />,
    <Column
      key="problem"
      name="Problem"
      cellRenderer={(row) => {
        const miss = misses[row];
        return (
          <Cell interactive className="wb-cell-strong" tooltip={miss?.problem}>
            {miss ? (
              <Link className="wb-row-link wb-mono" to={paths.app.miss.getHref(miss.id)}>
                {miss.problem}
              </Link>
            ) : null}
          </Cell>
        );
      }}
    />,
    <Column
      key="answer"
      name="Answer"
      cellRenderer={(row) => cell(row, misses[row]?.answer, 'wb-mono wb-pencil')}
    />,
    <Column
      key="kind"
      name="Kind"
      cellRenderer={(row) => {
        const miss = misses[row];
        const text = miss ? kindText(miss.kind, miss.stage) : '';
        // A word problem's stage on a second line, so the cell stays narrow.
        const [kind, stage] = text.split(': ');
        return cell(
          row,
          <span className="wb-kind-cell">
            <span>{kind}</span>
            {stage ? <span className="wb-muted">{stage}</span> : null}
          </span>,
          undefined,
          text,
        );
      }}
    />,
    <Column
      key="cause"
      name="Cause"
      cellRenderer={(row) => {
        const miss = misses[row];
        return cell(row, miss ? causeLabel(miss.cause) : '');
      }}
    />,
    <Column
      key="rule"
      name="Step error"
      cellRenderer={(row) => {
        const miss = misses[row];
        const first = miss ? shownRule(miss.ruleIds, filterRule) : undefined;
        const title = first ? ruleTitle(first) : miss?.checked ? '—' : 'Not checked';
        // Up to three lines: a step error's title is often longer than the column is wide.
        return cell(
          row,
          <span className="wb-wrap-cell">{title}</span>,
          first ? undefined : 'wb-muted',
          first ? title : undefined,
        );
      }}
    />,
    <Column
      key="status"
      name="Status"
      cellRenderer={(row) => {
        const miss = misses[row];
        return cell(row, miss ? statusLabel(miss.status) : '');
      }}
    />,
  ];
  return (
    <ListTable
      label="Misses"
      className="wb-notebook-table"
      numRows={misses.length}
      rowHeight={ROW_HEIGHT}
      columnWidths={WIDTHS}
      dependencies={[misses, studentName]}
    >
      {columns}
    </ListTable>
  );
}

import { Card } from '@blueprintjs/core';
import { PlusIcon, TimelineEventsIcon } from '@blueprintjs/icons';
import { Cell, Column } from '@blueprintjs/table';
import { Link } from 'react-router-dom';

import { LinkButton } from '../../../components/link-button';
import { ListTable, useTableFits } from '../../../components/list-table';
import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { paths } from '../../../config/paths';
import { useSittings } from '../api/get-sittings';
import { formatStartedAt, scoreText, TIME_OF_DAY_LABEL, type SittingSummary } from '../types';

const ROW_HEIGHT = 44;
const WIDTHS = [200, 110, 200, 100, 130];

type Props = { studentName: (id: number) => string; canEdit: boolean };

/** A marked sitting opens on its misses; an unmarked one on the marking grid. */
const hrefOf = (sitting: SittingSummary, canEdit: boolean) =>
  sitting.score.marked > 0 || !canEdit
    ? paths.app.sittingMisses.getHref(sitting.id)
    : paths.app.sitting.getHref(sitting.id);

function SittingsTable({
  sittings,
  studentName,
  canEdit,
}: { sittings: readonly SittingSummary[] } & Props) {
  return (
    <ListTable
      label="Sittings"
      numRows={sittings.length}
      rowHeight={ROW_HEIGHT}
      columnWidths={WIDTHS}
      dependencies={[sittings, canEdit]}
    >
      <Column
        name="Started"
        cellRenderer={(row) => {
          const sitting = sittings[row];
          return (
            <Cell interactive>
              {sitting ? (
                <Link to={hrefOf(sitting, canEdit)}>{formatStartedAt(sitting.startedAt)}</Link>
              ) : null}
            </Cell>
          );
        }}
      />
      <Column
        name="Student"
        cellRenderer={(row) => (
          <Cell className="wb-cell-strong">{studentName(sittings[row]?.studentId ?? 0)}</Cell>
        )}
      />
      <Column
        name="Key"
        cellRenderer={(row) => <Cell>{sittings[row]?.answerKey?.title ?? ''}</Cell>}
      />
      <Column
        name="Time of day"
        cellRenderer={(row) => (
          <Cell>{sittings[row] ? TIME_OF_DAY_LABEL[sittings[row].timeOfDay] : ''}</Cell>
        )}
      />
      <Column
        name="Score"
        cellRenderer={(row) => <Cell>{sittings[row] ? scoreText(sittings[row].score) : ''}</Cell>}
      />
    </ListTable>
  );
}

function SittingCards({
  sittings,
  studentName,
  canEdit,
}: { sittings: readonly SittingSummary[] } & Props) {
  return (
    <ul className="wb-cards" aria-label="Sittings">
      {sittings.map((sitting) => (
        <li key={sitting.id}>
          <Card className="wb-card">
            <div className="wb-card-main">
              <Link className="wb-card-title" to={hrefOf(sitting, canEdit)}>
                {studentName(sitting.studentId)} · {sitting.answerKey?.title}
              </Link>
              <span className="wb-muted">
                {formatStartedAt(sitting.startedAt)} · {scoreText(sitting.score)}
              </span>
            </div>
          </Card>
        </li>
      ))}
    </ul>
  );
}

/** The Sittings page: the latest sittings of the household, newest first. */
export function SittingsList({ studentName, canEdit }: Props) {
  const sittings = useSittings();
  const tableFits = useTableFits();
  const start = canEdit ? (
    <LinkButton to={paths.app.newSitting.getHref()} primary icon={<PlusIcon />}>
      Start a sitting
    </LinkButton>
  ) : null;

  let body;
  if (sittings.isPending) body = <LoadingState label="Loading sittings…" />;
  else if (sittings.isError) {
    body = (
      <ErrorState
        title="The sittings could not be loaded."
        error={sittings.error}
        onRetry={() => void sittings.refetch()}
      />
    );
  } else if (sittings.data.items.length === 0) {
    body = (
      <EmptyState
        icon={<TimelineEventsIcon size={40} />}
        title={
          canEdit
            ? 'No sittings yet. Start one when your child finishes a keyed worksheet or test.'
            : 'No sittings shared with you yet.'
        }
        action={start}
      />
    );
  } else if (tableFits)
    body = (
      <SittingsTable sittings={sittings.data.items} studentName={studentName} canEdit={canEdit} />
    );
  else
    body = (
      <SittingCards sittings={sittings.data.items} studentName={studentName} canEdit={canEdit} />
    );

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Sittings</h1>
          <p className="wb-muted">
            Each time a child does a keyed worksheet or assessment: mark it item by item, and every
            wrong item waits in the notebook as a miss to talk through.
          </p>
        </div>
        {sittings.isSuccess && sittings.data.items.length > 0 ? start : null}
      </div>
      {body}
      {sittings.isSuccess && sittings.data.total > sittings.data.items.length ? (
        <p className="wb-muted">
          Showing the latest {sittings.data.items.length} of {sittings.data.total}.
        </p>
      ) : null}
    </>
  );
}

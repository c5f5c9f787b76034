import { Button, Card, Intent, Tag } from '@blueprintjs/core';
import { DocumentIcon, ImportIcon, PlusIcon } from '@blueprintjs/icons';
import { Cell, Column } from '@blueprintjs/table';
import { useState } from 'react';
import { Link } from 'react-router-dom';

import { ListTable, useTableFits } from '../../../components/list-table';
import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { paths } from '../../../config/paths';
import { useAnswerKeys } from '../api/get-answer-keys';
import { KEY_KIND_LABEL, type AnswerKeySummary, type CourseOption } from '../types';
import { ImportKeyDialog } from './import-key-dialog';
import { NewKeyDialog } from './new-key-dialog';

const ROW_HEIGHT = 44;
const WIDTHS = [240, 110, 180, 70, 120, 90];

function FlagTag({ count }: { count: number }) {
  if (count === 0) return <span className="wb-muted">—</span>;
  return (
    <Tag minimal className="wb-tag-attention">
      {count} to check
    </Tag>
  );
}

function KeysTable({
  keys,
  courseName,
}: {
  keys: readonly AnswerKeySummary[];
  courseName: (id: number | null) => string;
}) {
  return (
    <ListTable
      label="Answer keys"
      numRows={keys.length}
      rowHeight={ROW_HEIGHT}
      columnWidths={WIDTHS}
      dependencies={[keys]}
    >
      <Column
        name="Title"
        cellRenderer={(row) => {
          const key = keys[row];
          return (
            <Cell interactive className="wb-cell-strong">
              {key ? <Link to={paths.app.answerKey.getHref(key.id)}>{key.title}</Link> : null}
            </Cell>
          );
        }}
      />
      <Column
        name="Kind"
        cellRenderer={(row) => <Cell>{keys[row] ? KEY_KIND_LABEL[keys[row].kind] : ''}</Cell>}
      />
      <Column
        name="Course"
        cellRenderer={(row) => <Cell>{courseName(keys[row]?.courseId ?? null)}</Cell>}
      />
      <Column name="Items" cellRenderer={(row) => <Cell>{keys[row]?.itemCount}</Cell>} />
      <Column
        name="Checker"
        cellRenderer={(row) => (
          <Cell>
            <FlagTag count={keys[row]?.flagCount ?? 0} />
          </Cell>
        )}
      />
      <Column name="Sittings" cellRenderer={(row) => <Cell>{keys[row]?.sittingCount}</Cell>} />
    </ListTable>
  );
}

function KeyCards({
  keys,
  courseName,
}: {
  keys: readonly AnswerKeySummary[];
  courseName: (id: number | null) => string;
}) {
  return (
    <ul className="wb-cards" aria-label="Answer keys">
      {keys.map((key) => (
        <li key={key.id}>
          <Card className="wb-card">
            <div className="wb-card-main">
              <Link className="wb-card-title" to={paths.app.answerKey.getHref(key.id)}>
                {key.title}
              </Link>
              <span className="wb-muted">
                {[KEY_KIND_LABEL[key.kind], courseName(key.courseId), `${key.itemCount} items`]
                  .filter((part) => part && part !== '—')
                  .join(' · ')}
                {key.sittingCount > 0 ? ` · ${key.sittingCount} sittings` : ''}
              </span>
            </div>
            {key.flagCount > 0 ? <FlagTag count={key.flagCount} /> : null}
          </Card>
        </li>
      ))}
    </ul>
  );
}

/** The Keys page: every answer key of the household, with new and import. */
export function KeysList({
  canEdit,
  courses,
}: {
  canEdit: boolean;
  courses: readonly CourseOption[];
}) {
  const keys = useAnswerKeys();
  const tableFits = useTableFits();
  const [dialog, setDialog] = useState<'new' | 'import' | null>(null);
  const courseName = (id: number | null) => courses.find((c) => c.id === id)?.name ?? '—';

  const actions = canEdit ? (
    <div className="wb-actions">
      <Button intent={Intent.PRIMARY} icon={<PlusIcon />} onClick={() => setDialog('new')}>
        New key
      </Button>
      <Button icon={<ImportIcon />} variant="outlined" onClick={() => setDialog('import')}>
        Import a CSV
      </Button>
    </div>
  ) : null;

  let body;
  if (keys.isPending) body = <LoadingState label="Loading answer keys…" />;
  else if (keys.isError) {
    body = (
      <ErrorState
        title="The answer keys could not be loaded."
        error={keys.error}
        onRetry={() => void keys.refetch()}
      />
    );
  } else if (keys.data.items.length === 0) {
    body = (
      <EmptyState
        icon={<DocumentIcon size={40} />}
        title={
          canEdit
            ? 'No answer keys yet. Type one in, or import the CSV of a worksheet’s answers.'
            : 'No answer keys yet. The family adds them here.'
        }
        action={actions}
      />
    );
  } else if (tableFits) {
    body = <KeysTable keys={keys.data.items} courseName={courseName} />;
  } else {
    body = <KeyCards keys={keys.data.items} courseName={courseName} />;
  }

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Answer keys</h1>
          <p className="wb-muted">
            The answers of each worksheet, review and assessment, with the lessons to revisit when
            an item is missed. The checker works each problem out and points out answers to look at
            again.
          </p>
        </div>
        {keys.isSuccess && keys.data.items.length > 0 ? actions : null}
      </div>
      {body}
      <NewKeyDialog open={dialog === 'new'} courses={courses} onClose={() => setDialog(null)} />
      <ImportKeyDialog
        open={dialog === 'import'}
        courses={courses}
        onClose={() => setDialog(null)}
      />
    </>
  );
}

import { Button, Classes } from '@blueprintjs/core';
import { ChevronLeftIcon, ChevronRightIcon, PlusIcon, ManualIcon } from '@blueprintjs/icons';
import { lazy, Suspense, useCallback, type ReactNode } from 'react';
import { Link } from 'react-router-dom';

import { useTableFits } from '../../../components/table-fits';
import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { paths } from '../../../config/paths';
import { useMisses } from '../api/get-misses';
import { useNotebookFilters } from '../hooks/use-notebook-filters';
import type { StudentOption } from '../types';
import { NotebookCards } from './notebook-cards';
import { NotebookFilters } from './notebook-filters';
import '../misses.css';

const LINK_BUTTON = `${Classes.BUTTON} ${Classes.INTENT_PRIMARY} wb-link-button`;
// Wide screens only: a phone shows cards and never downloads the table component.
const NotebookTable = lazy(() =>
  import('./notebook-table').then((m) => ({ default: m.NotebookTable })),
);

/** Every miss of the household, filtered and sorted on the server, the view kept in the URL. */
export function Notebook({
  students,
  canEdit,
  waiting,
}: {
  students: readonly StudentOption[];
  canEdit: boolean;
  /** Misses kept on this phone and not sent yet, shown under the heading. */
  waiting?: ReactNode;
}) {
  const { filters, value, set, clear, active } = useNotebookFilters();
  const misses = useMisses(filters);
  const tableFits = useTableFits();
  const studentName = useCallback(
    (id: number) => students.find((s) => s.id === id)?.name ?? '—',
    [students],
  );

  let body;
  if (misses.isPending) {
    body = <LoadingState label="Loading the notebook…" />;
  } else if (misses.isError) {
    body = (
      <ErrorState
        title="The notebook could not be loaded."
        error={misses.error}
        onRetry={() => void misses.refetch()}
      />
    );
  } else if (misses.data.total === 0) {
    body =
      active > 0 ? (
        <EmptyState
          icon={<ManualIcon size={40} />}
          title="No misses match these filters. Clear them to see every miss."
          action={<Button onClick={clear}>Clear filters</Button>}
        />
      ) : (
        <EmptyState
          icon={<ManualIcon size={40} />}
          title={
            canEdit
              ? 'No misses logged yet. After the next worksheet, log the first one.'
              : 'Nothing logged for the children shared with you yet.'
          }
          action={
            canEdit ? (
              <Link className={LINK_BUTTON} to={paths.app.logMiss.getHref()}>
                Log a miss
              </Link>
            ) : undefined
          }
        />
      );
  } else {
    const { items, total, page, pageSize } = misses.data;
    const pages = Math.max(1, Math.ceil(total / pageSize));
    const first = (page - 1) * pageSize + 1;
    const last = first + items.length - 1;
    body = (
      <>
        <p className="wb-muted wb-notebook-count" aria-live="polite">
          {items.length === 0
            ? `No misses on page ${page}.`
            : `Showing ${first}–${last} of ${total} ${total === 1 ? 'miss' : 'misses'}`}
          {misses.isFetching ? ' · updating…' : ''}
        </p>
        {tableFits ? (
          <Suspense fallback={<LoadingState label="Loading the notebook…" />}>
            <NotebookTable misses={items} studentName={studentName} />
          </Suspense>
        ) : (
          <NotebookCards misses={items} studentName={studentName} />
        )}
        {pages > 1 ? (
          <nav className="wb-pager" aria-label="Pages">
            <Button
              icon={<ChevronLeftIcon />}
              disabled={page <= 1}
              onClick={() => set({ page: String(page - 1) })}
            >
              Previous
            </Button>
            <span>
              Page {page} of {pages}
            </span>
            <Button
              endIcon={<ChevronRightIcon />}
              disabled={page >= pages}
              onClick={() => set({ page: String(page + 1) })}
            >
              Next
            </Button>
          </nav>
        ) : null}
      </>
    );
  }

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Notebook</h1>
          <p className="wb-muted">
            Every missed problem, newest first. Filter to spot what keeps coming back; the address
            of a filtered view can be bookmarked or shared.
          </p>
        </div>
        {canEdit ? (
          <Link className={`${LINK_BUTTON} wb-hide-phone`} to={paths.app.logMiss.getHref()}>
            <PlusIcon />
            <span className={Classes.BUTTON_TEXT}>Log a miss</span>
          </Link>
        ) : null}
      </div>
      {waiting}
      <NotebookFilters
        students={students}
        value={value}
        set={set}
        clear={clear}
        active={active}
        compact={!tableFits}
      />
      {body}
    </>
  );
}

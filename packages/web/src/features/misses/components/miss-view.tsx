import { Button, Callout, Tag } from '@blueprintjs/core';
import { EditIcon, TrashIcon } from '@blueprintjs/icons';
import { CAUSE_GUIDE } from '@workback/core';
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Link, useNavigate } from 'react-router-dom';

import { ErrorState, LoadingState } from '../../../components/states';
import { paths } from '../../../config/paths';
import { useMiss } from '../api/get-miss';
import { formatDay, type Miss, type StudentOption } from '../types';
import { DeleteMissAlert } from './delete-miss-alert';
import { EditMissDialog } from './edit-miss-dialog';
import { AddPhotos } from './add-photos';
import { NotesThread } from './notes-thread';
import { PhotoGallery } from './photo-gallery';
import { StatusButtons } from './status-buttons';
import { CheckersCaution, WorkingTrace } from './working-trace/working-trace';
import { LinesCheckView } from './word-problem';
import '../misses.css';

/** One miss: photos with pins, the working trace, the child's words, cause, status, notes. */
export function MissView({
  missId,
  students,
  canEdit,
  traceActions,
}: {
  missId: number;
  students: readonly StudentOption[];
  canEdit: boolean;
  /** What the app offers under the working (a check-up when several rules fit). */
  traceActions?: (miss: Miss) => ReactNode;
}) {
  const miss = useMiss(missId);
  const navigate = useNavigate();
  const [editing, setEditing] = useState(false);
  const [deleting, setDeleting] = useState(false);
  const heading = useRef<HTMLHeadingElement>(null);
  const loaded = miss.isSuccess;

  // A miss opens at its top, its heading focused (after Save, and from any link to it).
  useEffect(() => {
    if (!loaded) return;
    window.scrollTo({ top: 0 });
    heading.current?.focus({ preventScroll: true });
  }, [loaded, missId]);

  if (miss.isPending) return <LoadingState label="Loading the miss…" />;
  if (miss.isError) {
    return (
      <>
        <h1 className="wb-page-title">A miss</h1>
        <ErrorState
          title="This miss could not be loaded."
          error={miss.error}
          onRetry={() => void miss.refetch()}
        />
        <p>
          <Link to={paths.app.notebook.getHref()}>Back to the notebook</Link>
        </p>
      </>
    );
  }
  const m = miss.data;
  const student = students.find((s) => s.id === m.studentId)?.name ?? 'A student';
  const guide = CAUSE_GUIDE[m.cause];

  return (
    <article className="wb-miss">
      <p className="wb-back">
        <Link to={paths.app.notebook.getHref()}>← Notebook</Link>
      </p>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title wb-focus-target" ref={heading} tabIndex={-1}>
            <span className="wb-mono">{m.diagnosis?.problem.text ?? m.problem}</span>
          </h1>
          <p className="wb-muted">
            {student} · {formatDay(m.occurredOn)} · answered{' '}
            <span className="wb-mono wb-pencil">{m.answer}</span>
          </p>
        </div>
        {canEdit ? (
          <div className="wb-miss-actions">
            <Button icon={<EditIcon />} variant="outlined" onClick={() => setEditing(true)}>
              Edit
            </Button>
            <Button icon={<TrashIcon />} variant="minimal" onClick={() => setDeleting(true)}>
              Delete
            </Button>
          </div>
        ) : null}
      </div>

      <section className="wb-miss-section" aria-labelledby="status-title">
        <h2 id="status-title" className="wb-section-title">
          Where it stands
        </h2>
        <StatusButtons missId={m.id} status={m.status} canEdit={canEdit} />
      </section>

      <section className="wb-miss-section" aria-labelledby="photos-title">
        <h2 id="photos-title" className="wb-section-title">
          Photos
        </h2>
        <PhotoGallery missId={m.id} photos={m.photos} />
        {canEdit ? <AddPhotos missId={m.id} have={m.photos.length} /> : null}
      </section>

      <section className="wb-miss-section" aria-labelledby="trace-title">
        <h2 id="trace-title" className="wb-section-title">
          The working
        </h2>
        {m.diagnosis ? (
          <>
            <WorkingTrace diagnosis={m.diagnosis} />
            {traceActions?.(m)}
          </>
        ) : (
          <>
            <Callout className="wb-callout" title="Not checked">
              {m.notCheckedReason ?? 'The checkers could not read this problem.'} The cause is yours
              to choose from what the child tells you.
            </Callout>
            <CheckersCaution />
          </>
        )}
      </section>

      {m.lines && m.lines.length > 0 ? (
        <section className="wb-miss-section" aria-labelledby="lines-title">
          <h2 id="lines-title" className="wb-section-title">
            The number sentences
          </h2>
          <LinesCheckView check={m.linesCheck} lines={m.lines} stage={m.stage} />
        </section>
      ) : null}

      <div className="wb-miss-grid">
        <section className="wb-miss-section" aria-labelledby="said-title">
          <h2 id="said-title" className="wb-section-title">
            What the child said
          </h2>
          {m.explanation ? (
            <blockquote className="wb-said">{m.explanation}</blockquote>
          ) : (
            <p className="wb-muted">
              Nothing written down yet. Ask “Tell me how you started” and note their words.
            </p>
          )}
        </section>
        <section className="wb-miss-section" aria-labelledby="cause-title">
          <h2 id="cause-title" className="wb-section-title">
            Cause
          </h2>
          <p>
            <Tag minimal round size="large" className="wb-cause-tag">
              {guide.label}
            </Tag>{' '}
            <span className="wb-muted">{guide.hint}</span>
          </p>
          {m.suggestedCause && m.suggestedCause !== m.cause ? (
            <p className="wb-muted">
              The checkers suggested “{CAUSE_GUIDE[m.suggestedCause].label}”.
            </p>
          ) : null}
          {m.note ? <p className="wb-miss-note">{m.note}</p> : null}
          {!canEdit ? (
            <p className="wb-muted">
              Only the family changes the cause; add a note to suggest one.
            </p>
          ) : null}
        </section>
      </div>

      <section className="wb-miss-section" aria-labelledby="notes-title">
        <h2 id="notes-title" className="wb-section-title">
          Notes
        </h2>
        <NotesThread missId={m.id} />
      </section>

      {canEdit ? (
        <>
          <EditMissDialog miss={m} open={editing} onClose={() => setEditing(false)} />
          <DeleteMissAlert
            missId={m.id}
            open={deleting}
            onClose={() => setDeleting(false)}
            onDeleted={() => void navigate(paths.app.notebook.getHref(), { replace: true })}
          />
        </>
      ) : null}
    </article>
  );
}

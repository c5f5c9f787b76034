import { Card } from '@blueprintjs/core';
import { CameraIcon, EditIcon } from '@blueprintjs/icons';
import { Link } from 'react-router-dom';

import { LinkButton } from '../../../components/link-button';
import { paths } from '../../../config/paths';
import { scoreText, type MarkableItem, type Sitting } from '../types';
import { SittingHeader } from './sitting-header';

/**
 * After “Save marks”: every wrong item of the sitting, each waiting as a miss for the child’s
 * explanation and a photo, with the lessons the key says to revisit.
 */
export function SittingMisses({
  sitting,
  items,
  studentName,
  lessonTitle,
  canEdit,
}: {
  sitting: Sitting;
  items: readonly MarkableItem[];
  studentName: string;
  /** `lessonTitle(14)` → `'Regrouping across a zero'`, when the key has a course. */
  lessonTitle: (number: number) => string | undefined;
  canEdit: boolean;
}) {
  const byId = new Map(items.map((item) => [item.id, item]));
  const wrong = sitting.marks
    .filter((mark) => !mark.correct)
    .map((mark) => ({ mark, item: byId.get(mark.keyItemId) }))
    .sort((a, b) => (a.item?.number ?? 0) - (b.item?.number ?? 0));

  return (
    <>
      <SittingHeader sitting={sitting} studentName={studentName} title={scoreText(sitting.score)} />
      <section aria-labelledby="new-misses-title">
        <h2 id="new-misses-title" className="wb-subhead">
          {wrong.length === 0
            ? 'No misses this time'
            : `${wrong.length} miss${wrong.length === 1 ? '' : 'es'} to talk through`}
        </h2>
        <p className="wb-muted">
          {wrong.length === 0
            ? 'Every marked item was right. Nothing waits in the notebook from this sitting.'
            : `Sit with ${studentName} and ask how they solved each one; add their words and a photo of the working. Each miss is already in the notebook.`}
        </p>
        {wrong.length > 0 ? (
          <ul className="wb-sitting-misses" aria-label="Misses from this sitting">
            {wrong.map(({ mark, item }) => (
              <li key={mark.id}>
                <Card className="wb-sitting-miss">
                  <div className="wb-sitting-miss-main">
                    <p className="wb-sitting-miss-problem">
                      <span className="wb-muted">Item {mark.number ?? item?.number}</span>{' '}
                      <span className="wb-digits">{item?.prompt}</span>
                    </p>
                    <p>
                      Wrote <span className="wb-digits wb-child-answer">{mark.answer ?? '—'}</span>
                      {item ? (
                        <>
                          {' '}
                          · key <span className="wb-digits">{item.answer}</span>
                        </>
                      ) : null}
                    </p>
                    <p className="wb-revisit">
                      <span className="wb-revisit-label">Lessons to revisit:</span>{' '}
                      {item && item.revisitLessons.length > 0
                        ? item.revisitLessons
                            .map((n) => {
                              const title = lessonTitle(n);
                              return title ? `${n} (${title})` : String(n);
                            })
                            .join(', ')
                        : 'none listed in the key'}
                      {item && item.facts.length > 0
                        ? ` · practise the ${item.facts.join(', ')}`
                        : ''}
                    </p>
                  </div>
                  {mark.missId !== null ? (
                    <LinkButton
                      to={paths.app.miss.getHref(mark.missId)}
                      icon={<CameraIcon />}
                      outlined
                      className="wb-sitting-miss-action"
                    >
                      {canEdit
                        ? `Explain item ${mark.number ?? ''}`
                        : `Open item ${mark.number ?? ''}`}
                    </LinkButton>
                  ) : null}
                </Card>
              </li>
            ))}
          </ul>
        ) : null}
      </section>
      <p className="wb-sitting-links">
        {canEdit ? (
          <Link to={paths.app.sitting.getHref(sitting.id)}>
            <EditIcon /> Change the marks
          </Link>
        ) : null}
        <Link to={paths.app.sittings.getHref()}>All sittings</Link>
      </p>
    </>
  );
}

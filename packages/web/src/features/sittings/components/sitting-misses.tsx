import { Button, Card } from '@blueprintjs/core';
import { CameraIcon, EditIcon } from '@blueprintjs/icons';
import { Link } from 'react-router-dom';
import type { ReactNode } from 'react';

import { FormError } from '../../../components/form/form-error';
import { LinkButton } from '../../../components/link-button';
import { useToast } from '../../../components/toaster';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useSaveMarks } from '../api/save-marks';
import { scoreText, type MarkableItem, type Sitting, type SittingMark } from '../types';
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
  const allWrong = sitting.marks
    .filter((mark) => !mark.correct)
    .map((mark) => ({ mark, item: byId.get(mark.keyItemId) }))
    .sort((a, b) => (a.item?.number ?? 0) - (b.item?.number ?? 0));
  // A wrong mark on an item whose key answer the checker flags waits for the parent's word.
  const held = allWrong.filter(({ mark }) => mark.held === true);
  const wrong = allWrong.filter(({ mark }) => mark.held !== true);

  return (
    <>
      <SittingHeader sitting={sitting} studentName={studentName} title={scoreText(sitting.score)} />
      <section aria-labelledby="new-misses-title">
        <h2 id="new-misses-title" className="wb-subhead">
          {wrong.length > 0
            ? `${wrong.length} miss${wrong.length === 1 ? '' : 'es'} to talk through`
            : held.length > 0
              ? 'No misses yet'
              : 'No misses this time'}
        </h2>
        <p className="wb-muted">
          {wrong.length > 0
            ? `Sit with ${studentName} and ask how they solved each one; add their words and a photo of the working. Each miss is already in the notebook.`
            : held.length > 0
              ? 'Nothing is in the notebook from this sitting until the key is checked (below).'
              : 'Every marked item was right. Nothing waits in the notebook from this sitting.'}
        </p>
        {wrong.length > 0 ? (
          <ul className="wb-sitting-misses" aria-label="Misses from this sitting">
            {wrong.map(({ mark, item }) => (
              <li key={mark.id}>
                <Card className="wb-sitting-miss">
                  <div className="wb-sitting-miss-main">
                    <MarkedItem mark={mark} item={item} />
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
      {held.length > 0 ? <HeldItems sitting={sitting} held={held} canEdit={canEdit} /> : null}
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

/**
 * Wrong items whose key answer the checker flags: no miss is made from them until the parent
 * says the key's answer is right (the miss is made now) or fixes the key (re-marking follows).
 */
function HeldItems({
  sitting,
  held,
  canEdit,
}: {
  sitting: Sitting;
  held: { mark: SittingMark; item: MarkableItem | undefined }[];
  canEdit: boolean;
}) {
  const save = useSaveMarks();
  const toast = useToast();
  const keyIsRight = (keyItemId: number) =>
    save.mutate(
      {
        sittingId: sitting.id,
        marks: sitting.marks.map((m) => ({
          keyItemId: m.keyItemId,
          correct: m.correct,
          answer: m.answer,
          ...(m.keyItemId === keyItemId ? { keyAnswerRight: true } : {}),
        })),
      },
      {
        onSuccess: (saved) => {
          const made = saved.misses.createdMissIds.length + saved.misses.reopenedMissIds.length;
          toast(made > 0 ? 'The miss is made: it is in the notebook.' : 'Saved.');
        },
      },
    );
  return (
    <section aria-labelledby="held-title" className="wb-held">
      <h2 id="held-title" className="wb-subhead">
        {held.length === 1 ? '1 item waits' : `${held.length} items wait`} for the key to be checked
      </h2>
      <p className="wb-muted">
        The checker works these out differently from the key. No miss is made from them until you
        say which answer is right.
      </p>
      <FormError
        message={
          save.isError
            ? isApiError(save.error)
              ? `Nothing was changed: ${save.error.message}`
              : 'Nothing was changed. Please try again.'
            : null
        }
      />
      <ul className="wb-sitting-misses" aria-label="Waiting for the key to be checked">
        {held.map(({ mark, item }) => (
          <li key={mark.id}>
            <Card className="wb-sitting-miss wb-sitting-held">
              <div className="wb-sitting-miss-main">
                <MarkedItem mark={mark} item={item}>
                  {item?.check?.expected ? (
                    <>
                      {' '}
                      · the checker works it out as{' '}
                      <span className="wb-digits">{item.check.expected}</span>
                    </>
                  ) : null}
                </MarkedItem>
              </div>
              {canEdit && item ? (
                <div className="wb-actions wb-sitting-miss-action">
                  <Button
                    variant="outlined"
                    loading={save.isPending}
                    onClick={() => keyIsRight(mark.keyItemId)}
                  >
                    The key’s {item.answer} is right: make the miss
                  </Button>
                  <Link to={paths.app.answerKey.getHref(sitting.answerKeyId)}>
                    Fix the key’s answer
                  </Link>
                </div>
              ) : null}
            </Card>
          </li>
        ))}
      </ul>
    </section>
  );
}

/** A marked item as the child answered it: its number and prompt, what they wrote, the key's answer. */
function MarkedItem({
  mark,
  item,
  children,
}: {
  mark: SittingMark;
  item: MarkableItem | undefined;
  /** Said after the key's answer. */
  children?: ReactNode;
}) {
  return (
    <>
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
            {children}
          </>
        ) : null}
      </p>
    </>
  );
}

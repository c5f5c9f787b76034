import { useNavigate } from 'react-router-dom';

import { FormError } from '../../../components/form/form-error';
import { useToast } from '../../../components/toaster';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useSaveMarks } from '../api/save-marks';
import { scoreText, type MarkableItem, type Sitting } from '../types';
import { MarkingGrid } from './marking-grid';
import { SittingHeader } from './sitting-header';

/** The marking page: the grid, then “Save marks” lands on the new misses. */
export function SittingMarking({
  sitting,
  items,
  studentName,
}: {
  sitting: Sitting;
  items: readonly MarkableItem[];
  studentName: string;
}) {
  const save = useSaveMarks();
  const navigate = useNavigate();
  const toast = useToast();
  return (
    <>
      <SittingHeader sitting={sitting} studentName={studentName} title="Mark the sitting" />
      <FormError
        message={
          save.isError
            ? isApiError(save.error)
              ? `The marks were not saved: ${save.error.message}`
              : 'The marks were not saved. Please try again.'
            : null
        }
      />
      {items.length === 0 ? (
        <p className="wb-muted">This key has no items yet. Add them on the key’s page first.</p>
      ) : (
        <MarkingGrid
          items={items}
          saved={sitting.marks}
          answerKeyId={sitting.answerKeyId}
          saving={save.isPending}
          onSave={(marks) =>
            save.mutate(
              { sittingId: sitting.id, marks },
              {
                onSuccess: (saved) => {
                  const held = saved.misses.heldItemIds?.length ?? 0;
                  toast(
                    `Saved: ${scoreText(saved.score)}.` +
                      (held > 0
                        ? ` ${held === 1 ? '1 item waits' : `${held} items wait`} for the key to be checked before it counts as a miss.`
                        : ''),
                  );
                  void navigate(paths.app.sittingMisses.getHref(saved.id));
                },
              },
            )
          }
        />
      )}
    </>
  );
}

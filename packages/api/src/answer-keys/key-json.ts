import type { AnswerKey } from './models/answer-key.model.js';
import type { KeyCorrection } from './models/key-correction.model.js';

/** A key's own fields, as every answer about keys starts. */
export function toKeySummary(k: AnswerKey) {
  return {
    id: k.id,
    title: k.title,
    kind: k.kind,
    courseId: k.courseId,
    lessonNumber: k.lessonNumber,
    createdAt: k.createdAt,
    updatedAt: k.updatedAt,
  };
}

/** A correction, with the re-marked sittings the reader may see. */
export function toCorrectionJson(c: KeyCorrection, remarked: readonly number[] = c.remarked) {
  return {
    id: c.id,
    itemId: c.keyItemId,
    itemNumber: c.itemNumber,
    changes: c.changes,
    reason: c.reason,
    madeBy: { userId: c.madeByUserId, name: c.madeByName },
    createdAt: c.createdAt,
    remarkedSittingIds: remarked,
  };
}

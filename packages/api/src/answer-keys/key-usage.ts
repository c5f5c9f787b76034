import type { Transaction } from 'sequelize';
import type { MemberContext } from '../common/member-context.js';

/** An item's answer changed after sittings were marked against it. */
export interface AnswerChange {
  itemId: number;
  number: number;
  from: string;
  to: string;
}

export interface RemarkedSitting {
  sittingId: number;
  studentId: number;
  before: { correct: number; marked: number };
  after: { correct: number; marked: number };
  /** The items whose marks changed in this sitting. */
  itemIds: number[];
  resolvedMissIds: number[];
  newMissIds: number[];
}

/** What the sittings module tells keys about their use, and how it re-marks after a correction. */
export interface KeyUsage {
  /** Sittings per key; with `studentIds` (a tutor's grant), only those students' sittings. */
  sittingCounts(
    keyIds: readonly number[],
    transaction?: Transaction,
    studentIds?: readonly number[] | null,
  ): Promise<Map<number, number>>;
  /** Which of these sittings are of these students. */
  sittingsOf(
    sittingIds: readonly number[],
    studentIds: readonly number[],
    transaction?: Transaction,
  ): Promise<Set<number>>;
  markCounts(itemIds: readonly number[], transaction?: Transaction): Promise<Map<number, number>>;
  remark(
    member: MemberContext,
    changes: readonly AnswerChange[],
    reason: string,
    transaction: Transaction,
  ): Promise<RemarkedSitting[]>;
}

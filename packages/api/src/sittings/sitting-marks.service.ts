import { Injectable, type OnModuleInit } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { revisitLessons, type Cause } from '@workback/core';
import { Op, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { AnswerKeysService } from '../answer-keys/answer-keys.service.js';
import type { AnswerChange, RemarkedSitting } from '../answer-keys/key-usage.js';
import { AnswerKey } from '../answer-keys/models/answer-key.model.js';
import type { KeyItem } from '../answer-keys/models/key-item.model.js';
import { sameAnswer as sameAnswerOf } from '../answer-keys/same-answer.js';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { allQueries } from '../database/in-transaction.js';
import { MarkedMissesService } from '../misses/marked-misses.service.js';
import type { PutMarksDto } from './dto/put-marks.dto.js';
import { SittingMark } from './models/sitting-mark.model.js';
import { Sitting } from './models/sitting.model.js';
import { keyFlagged, tallyOf } from './sitting-json.js';
import { type SittingRead, SittingsService } from './sittings.service.js';

/** What a mark save or a re-marking did to the sitting's misses. */
export interface MissChanges {
  /** Wrong marks on items whose key answer the checker flags: no miss until the key is checked. */
  heldItemIds: number[];
  createdMissIds: number[];
  reopenedMissIds: number[];
  resolvedMissIds: number[];
  updatedMissIds: number[];
}

/**
 * A sitting's marks and the misses they make: saving marks, and re-marking after a key's
 * answer is corrected (the keys module calls back here through its KeyUsage).
 */
@Injectable()
export class SittingMarksService implements OnModuleInit {
  constructor(
    @InjectModel(Sitting) private readonly sittingModel: typeof Sitting,
    @InjectModel(SittingMark) private readonly markModel: typeof SittingMark,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly sittings: SittingsService,
    private readonly keys: AnswerKeysService,
    private readonly misses: MarkedMissesService,
  ) {}

  onModuleInit(): void {
    this.keys.registerUsage({
      sittingCounts: (ids, t, studentIds) => this.sittings.sittingCounts(ids, t, studentIds),
      sittingsOf: (ids, studentIds, t) => this.sittings.sittingsOf(ids, studentIds, t),
      markCounts: (ids, t) => this.markCounts(ids, t),
      remark: (member, changes, reason, t) => this.remark(member, changes, reason, t),
    });
  }

  /**
   * Saves every mark of a sitting in one transaction and keeps its misses in step: a wrong
   * item gets a miss, a wrong item turned right resolves it. Saving the same marks twice
   * changes nothing.
   */
  async putMarks(member: MemberContext, id: number, dto: PutMarksDto) {
    // Marks sent again as they are saved (a retry after a lost answer, a second tap) change
    // nothing: answered from reads, without queueing for the write lock behind every family.
    const read = await this.sittings.readWhole(member, id);
    if (savedAlready(dto, read)) return { ...this.sittings.toJson(read), misses: emptyChanges() };
    const { answerKeyId } = read.sitting;
    const changes = await this.sequelize.transaction(async (transaction) => {
      // The four reads at once where the database allows (allQueries): each turn of the event
      // loop is time the write queue waits. A sitting's answer key is fixed when it is made, so
      // its items need not wait for it. Where they go in turn (PostgreSQL) the sitting's row
      // lock comes first, so two saves at once go in turn and the second reads the first's
      // marks instead of inserting them again (the marks' unique index refused it, 409).
      const [sitting, items, marks, misses] = await allQueries(this.sequelize, transaction, [
        () => this.sittings.findModel(member, id, transaction, { lock: true }),
        () => this.keys.itemsOf(answerKeyId, transaction),
        () => this.markModel.findAll({ where: { sittingId: id }, transaction }),
        () => this.misses.findForSitting(id, transaction),
      ] as const);
      const byId = itemsMarked(dto, items);

      const existing = new Map(marks.map((m) => [m.keyItemId, m]));
      // Each item's writes in order, in the marks' order; the items' side by side (allItems).
      const work: ItemWrites[] = [];
      const added: Pick<SittingMark, 'sittingId' | 'keyItemId' | 'correct' | 'answer'>[] = [];
      for (const m of dto.marks) {
        const answer = answerOf(m);
        const before = existing.get(m.keyItemId);
        existing.delete(m.keyItemId);
        const item = byId.get(m.keyItemId)!;
        const hold = keyFlagged(item) && m.keyAnswerRight !== true;
        if (before && before.correct === m.correct && before.answer === answer) {
          // The same wrong mark, now with the key's answer said to be right: its miss is made.
          if (!m.correct && !hold && keyFlagged(item) && !misses.has(item.id))
            work.push((changes) =>
              this.followMark(
                member,
                sitting,
                item,
                null,
                { correct: false, answer, cause: m.cause ?? undefined },
                '',
                { changes, misses },
                transaction,
              ),
            );
          continue;
        }
        const was = before ? { correct: before.correct, answer: before.answer } : null;
        if (!before)
          added.push({ sittingId: id, keyItemId: m.keyItemId, correct: m.correct, answer });
        work.push(async (changes) => {
          if (before) await before.update({ correct: m.correct, answer }, { transaction });
          await this.followMark(
            member,
            sitting,
            item,
            was,
            { correct: m.correct, answer, cause: m.cause ?? undefined },
            'the mark was changed to right',
            { changes, misses, hold },
            transaction,
          );
        });
      }
      if (added.length) work.push(() => this.markModel.bulkCreate(added, { transaction }));
      for (const [itemId, left] of existing) {
        work.push(async (changes) => {
          await left.destroy({ transaction });
          await this.followMark(
            member,
            sitting,
            byId.get(itemId)!,
            { correct: left.correct, answer: left.answer },
            null,
            'the item’s mark was removed from the sitting',
            { changes, misses },
            transaction,
          );
        });
      }
      return allItems(this.sequelize, transaction, work);
    });
    // Read once committed, outside the transaction: this process's writes queue behind each
    // transaction, so it holds the queue only for what must be read and written together.
    return { ...(await this.sittings.findOne(member, id)), misses: changes };
  }

  /** Re-marks every sitting marked against items whose key answer was corrected. */
  async remark(
    member: MemberContext,
    changes: readonly AnswerChange[],
    reason: string,
    transaction: Transaction,
  ): Promise<RemarkedSitting[]> {
    const byItem = new Map(changes.map((c) => [c.itemId, c]));
    const marks = await this.markModel.findAll({
      where: { keyItemId: { [Op.in]: [...byItem.keys()] } },
      transaction,
    });
    const sittingIds = [...new Set(marks.map((m) => m.sittingId))];
    if (sittingIds.length === 0) return [];
    const sittings = await this.sittingModel.findAll({
      where: { id: { [Op.in]: sittingIds }, householdId: member.householdId },
      include: [AnswerKey],
      transaction,
    });
    const items = new Map(
      (await this.keys.itemsOf(sittings[0]!.answerKeyId, transaction)).map((i) => [i.id, i]),
    );
    const before = await this.sittings.tallies(sittingIds, transaction);
    const out: RemarkedSitting[] = [];
    for (const sitting of sittings) {
      const missChanges = emptyChanges();
      const misses = await this.misses.findForSitting(sitting.id, transaction);
      const itemIds: number[] = [];
      for (const mark of marks.filter((m) => m.sittingId === sitting.id)) {
        const change = byItem.get(mark.keyItemId)!;
        // A right mark with no answer typed means the child wrote what the key said then.
        const childAnswer = mark.answer ?? (mark.correct ? change.from : null);
        const correct = childAnswer !== null && sameAnswerOf(childAnswer, change.to);
        if (correct === mark.correct) {
          // A wrong mark held while the key was flagged gets its miss once the key is checked.
          const item = items.get(mark.keyItemId)!;
          if (!correct && !misses.has(item.id) && !keyFlagged(item)) {
            await this.followMark(
              member,
              sitting,
              item,
              null,
              { correct: false, answer: mark.answer },
              '',
              { changes: missChanges, misses },
              transaction,
            );
            itemIds.push(mark.keyItemId);
          }
          continue;
        }
        const was = { correct: mark.correct, answer: mark.answer };
        await mark.update({ correct, answer: childAnswer }, { transaction });
        itemIds.push(mark.keyItemId);
        await this.followMark(
          member,
          sitting,
          items.get(mark.keyItemId)!,
          was,
          { correct, answer: childAnswer },
          `the key was corrected (item ${change.number}: ${change.from} → ${change.to}): ${reason}`,
          { changes: missChanges, misses },
          transaction,
        );
      }
      if (itemIds.length === 0) continue;
      const after = tallyOf(
        await this.markModel.findAll({ where: { sittingId: sitting.id }, transaction }),
      );
      out.push({
        sittingId: sitting.id,
        studentId: sitting.studentId,
        before: before.get(sitting.id) ?? { correct: 0, marked: 0 },
        after,
        itemIds,
        resolvedMissIds: missChanges.resolvedMissIds,
        newMissIds: [...missChanges.createdMissIds, ...missChanges.reopenedMissIds],
      });
    }
    return out;
  }

  /**
   * Keeps one item's miss in step with its mark, by the change of the mark (so repeating a
   * save does nothing): wrong now and not before → a miss (or its old one reopened); right
   * or unmarked now after wrong → resolved with the reason; wrong with a new answer → the
   * miss takes the new answer.
   */
  private async followMark(
    member: MemberContext,
    sitting: Sitting,
    item: KeyItem,
    was: { correct: boolean; answer: string | null } | null,
    now: { correct: boolean; answer: string | null; cause?: Cause } | null,
    resolveReason: string,
    {
      changes,
      misses,
      hold = false,
    }: {
      changes: MissChanges;
      misses: Map<number, { id: number; status: string }>;
      hold?: boolean;
    },
    transaction: Transaction,
  ): Promise<void> {
    const wasWrong = was !== null && !was.correct;
    const nowWrong = now !== null && !now.correct;
    if (!wasWrong && !nowWrong) return;
    const existing = misses.get(item.id);
    if (nowWrong && !wasWrong && hold && !existing) {
      changes.heldItemIds.push(item.id);
      return;
    }
    if (nowWrong && !wasWrong) {
      if (existing) {
        await this.misses.reopenFromMark(member, existing.id, now.answer ?? '', transaction);
        existing.status = 'logged';
        changes.reopenedMissIds.push(existing.id);
      } else {
        const id = await this.misses.createFromMark(
          member,
          {
            studentId: sitting.studentId,
            occurredOn: sitting.startedAt.slice(0, 10),
            problem: item.prompt,
            answer: now.answer ?? '',
            skills: item.skills,
            revisit: revisitLessons(item.revisit).map(String),
            sittingId: sitting.id,
            keyItemId: item.id,
            cause: now.cause,
          },
          transaction,
        );
        misses.set(item.id, { id, status: 'logged' });
        changes.createdMissIds.push(id);
      }
    } else if (wasWrong && !nowWrong) {
      if (existing && existing.status !== 'resolved') {
        await this.misses.resolveFromMark(member, existing.id, resolveReason, transaction);
        existing.status = 'resolved';
        changes.resolvedMissIds.push(existing.id);
      }
    } else if (existing && (was!.answer ?? '') !== (now!.answer ?? '')) {
      await this.misses.answerFromMark(member, existing.id, now!.answer ?? '', transaction);
      changes.updatedMissIds.push(existing.id);
    }
  }

  async markCounts(itemIds: readonly number[], transaction?: Transaction) {
    const rows = (await this.markModel.count({
      where: { keyItemId: { [Op.in]: [...itemIds] } },
      group: ['keyItemId'],
      transaction,
    })) as unknown as { keyItemId: number; count: number }[];
    return new Map(rows.map((r) => [r.keyItemId, r.count]));
  }
}

/**
 * Whether the sitting's saved marks are exactly `dto`'s, so saving it would change nothing; a
 * save naming items wrongly is refused here as the write would refuse it. Read outside a
 * transaction: the marks are one query, so they are all from one moment, and this save is then
 * the same as one made at that moment.
 */
function savedAlready(dto: PutMarksDto, { items, marks }: SittingRead): boolean {
  const byId = itemsMarked(dto, items);
  if (marks.length !== dto.marks.length) return false;
  const savedMarks = new Map(marks.map((m) => [m.keyItemId, m]));
  return dto.marks.every((m) => {
    const before = savedMarks.get(m.keyItemId);
    return (
      before !== undefined &&
      before.correct === m.correct &&
      before.answer === answerOf(m) &&
      // A wrong mark whose flagged key answer is now said to be right may make its miss.
      (m.correct || m.keyAnswerRight !== true || !keyFlagged(byId.get(m.keyItemId)!))
    );
  });
}

/** The sitting's key items by id, once every mark names one of them, and only once. */
function itemsMarked(dto: PutMarksDto, items: readonly KeyItem[]): Map<number, KeyItem> {
  const byId = new Map(items.map((i) => [i.id, i]));
  const errors: Record<string, string> = {};
  const seen = new Map<number, number>();
  dto.marks.forEach((m, index) => {
    if (!byId.has(m.keyItemId)) {
      errors[`marks.${index}.keyItemId`] = `item ${m.keyItemId} is not in this sitting’s key`;
    } else if (seen.has(m.keyItemId)) {
      errors[`marks.${index}.keyItemId`] =
        `item ${byId.get(m.keyItemId)!.number} is marked twice (also marks.${seen.get(m.keyItemId)})`;
    }
    seen.set(m.keyItemId, index);
  });
  if (Object.keys(errors).length) throw fieldsError(errors);
  return byId;
}

/** The child's answer as saved: none typed is null. */
const answerOf = (m: PutMarksDto['marks'][number]) =>
  m.answer === undefined || m.answer === '' ? null : m.answer;

/** One item's writes, noting what they did to its miss in `changes`. */
type ItemWrites = (changes: MissChanges) => Promise<unknown>;

/**
 * Runs each item's writes, the items' side by side on SQLite, and merges what they did in the
 * items' order. In a transaction on SQLite's write connection, statements sent together run
 * back to back on the worker threads; sent one after another, each waited for a turn of the
 * event loop while the transaction held the write lock every family's writes queue for (a
 * sitting's first marks held it 40–210 ms at 150 req/s). `allQueries` lets every item's writes
 * finish before an error is thrown, and sends them in turn on PostgreSQL.
 */
async function allItems(
  sequelize: Sequelize,
  transaction: Transaction,
  work: readonly ItemWrites[],
): Promise<MissChanges> {
  const each = work.map(() => emptyChanges());
  await allQueries(
    sequelize,
    transaction,
    work.map((writes, i) => () => writes(each[i]!)),
  );
  const merged = emptyChanges();
  for (const changes of each)
    for (const key of Object.keys(merged) as (keyof MissChanges)[])
      merged[key].push(...changes[key]);
  return merged;
}

export const emptyChanges = (): MissChanges => ({
  heldItemIds: [],
  createdMissIds: [],
  reopenedMissIds: [],
  resolvedMissIds: [],
  updatedMissIds: [],
});

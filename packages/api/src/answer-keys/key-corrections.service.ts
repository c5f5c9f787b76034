import { ConflictException, Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { UsersService } from '../users/users.service.js';
import { AnswerKeysService } from './answer-keys.service.js';
import type { AnswerChange, RemarkedSitting } from './key-usage.js';
import type { UpdateAnswerKeyDto } from './dto/update-answer-key.dto.js';
import { checkItems, ITEM_FIELDS, type CourseLessons, type ItemFields } from './key-item-checks.js';
import { toCorrectionJson } from './key-json.js';
import type { AnswerKey } from './models/answer-key.model.js';
import { KeyCorrection, type FieldChange } from './models/key-correction.model.js';
import { KeyItem } from './models/key-item.model.js';
import { sameAnswer } from './same-answer.js';

/** Edits to a key; once it has sittings, each change is a correction and its sittings are re-marked. */
@Injectable()
export class KeyCorrectionsService {
  constructor(
    private readonly keys: AnswerKeysService,
    @InjectModel(KeyItem) private readonly itemModel: typeof KeyItem,
    @InjectModel(KeyCorrection) private readonly correctionModel: typeof KeyCorrection,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly users: UsersService,
  ) {}

  /**
   * Edits a key. Once it has sittings, every changed item is recorded as a correction
   * (what, why, when, who) and the sittings marked against it are re-marked.
   */
  async update(member: MemberContext, id: number, dto: UpdateAnswerKeyDto) {
    return this.sequelize.transaction(async (transaction) => {
      // The key's row first: the same correction sent twice at once then goes in turn, and the
      // second reads the first's items instead of adding its new ones again (on PostgreSQL the
      // items' unique (key, number) index refused it, 409).
      const key = await this.keys.findKeyModel(member, id, transaction, { lock: true });
      const courseId = dto.courseId !== undefined ? dto.courseId : key.courseId;
      const lessonNumber = dto.lessonNumber !== undefined ? dto.lessonNumber : key.lessonNumber;
      const lessons = await this.keys.lessonsFor(member, courseId, lessonNumber, transaction);
      const existing = await this.keys.itemsOf(key.id, transaction);

      let corrections: KeyCorrection[] = [];
      let remarked: RemarkedSitting[] = [];
      if (dto.items !== undefined) {
        ({ corrections, remarked } = await this.replaceItems(
          member,
          key,
          existing,
          dto,
          lessons,
          transaction,
        ));
      } else if (courseId !== key.courseId && lessons) {
        // A new course: the lessons to revisit must exist in it.
        checkItems(existing, lessons, (i) => `items.${i}`);
      }
      await key.update(
        {
          ...(dto.title !== undefined && { title: dto.title }),
          ...(dto.kind !== undefined && { kind: dto.kind }),
          courseId,
          lessonNumber,
        },
        { transaction },
      );
      return {
        ...(await this.keys.toKeyJson(key, transaction)),
        newCorrections: corrections.map((c) => toCorrectionJson(c)),
        remarkedSittings: remarked,
      };
    });
  }

  private async replaceItems(
    member: MemberContext,
    key: AnswerKey,
    existing: KeyItem[],
    dto: UpdateAnswerKeyDto,
    lessons: CourseLessons,
    transaction: Transaction,
  ) {
    const input = dto.items!;
    const byId = new Map(existing.map((i) => [i.id, i]));
    const idErrors: Record<string, string> = {};
    const seen = new Set<number>();
    input.forEach((item, index) => {
      if (item.id === undefined) return;
      if (!byId.has(item.id)) idErrors[`items.${index}.id`] = `item ${item.id} is not in this key`;
      else if (seen.has(item.id)) idErrors[`items.${index}.id`] = `item ${item.id} is listed twice`;
      seen.add(item.id);
    });
    const clean = checkItems(input, lessons, (i) => `items.${i}`, idErrors);

    const removed = existing.filter((i) => !seen.has(i.id));
    const marks = await this.keys.markCounts(
      existing.map((i) => i.id),
      transaction,
    );
    const removedMarked = removed.filter((i) => (marks.get(i.id) ?? 0) > 0);
    if (removedMarked.length > 0) {
      throw new ConflictException(
        `${removedMarked.map((i) => `item ${i.number}`).join(', ')} ${removedMarked.length === 1 ? 'has' : 'have'} marks in sittings; correct ${removedMarked.length === 1 ? 'it' : 'them'} instead of removing`,
      );
    }

    const hasSittings =
      ((await this.keys.sittingCounts([key.id], transaction)).get(key.id) ?? 0) > 0;
    const edits = input.flatMap((item, index) => {
      if (item.id === undefined) return [];
      const before = byId.get(item.id)!;
      const changes = diffItem(before, clean[index]!);
      return Object.keys(changes).length ? [{ before, after: clean[index]!, changes }] : [];
    });
    if (hasSittings && (edits.length > 0 || removed.length > 0) && !dto.reason) {
      throw fieldsError({
        reason:
          'say why the key changed: this key has sittings, and the reason is kept with the correction',
      });
    }

    // Renumbered items step aside first so the unique (key, number) index never sees a clash.
    for (const { before } of edits.filter((e) => 'number' in e.changes)) {
      await before.update({ number: -before.id }, { transaction });
    }
    for (const { before, after } of edits) await before.update(after, { transaction });
    if (removed.length) {
      await this.correctionModel.update(
        { keyItemId: null },
        { where: { keyItemId: removed.map((i) => i.id) }, transaction },
      );
      await this.itemModel.destroy({ where: { id: removed.map((i) => i.id) }, transaction });
    }
    const added = input.flatMap((item, index) => (item.id === undefined ? [clean[index]!] : []));
    if (added.length) {
      await this.itemModel.bulkCreate(
        added.map((i) => ({ ...i, answerKeyId: key.id })),
        { transaction },
      );
    }

    if (!hasSittings) return { corrections: [], remarked: [] };
    const reason = dto.reason!;
    const answerChanges: AnswerChange[] = edits.flatMap((e) => {
      const from = e.changes.answer ? String(e.changes.answer.from) : null;
      return from !== null && !sameAnswer(from, e.after.answer)
        ? [{ itemId: e.before.id, number: e.after.number, from, to: e.after.answer }]
        : [];
    });
    const remarked = answerChanges.length
      ? await this.keys.remark(member, answerChanges, reason, transaction)
      : [];
    const author = await this.users.findById(member.userId);
    const corrections: KeyCorrection[] = [];
    for (const e of edits) {
      const touched = remarked
        .filter((r) => r.itemIds.includes(e.before.id))
        .map((r) => r.sittingId);
      corrections.push(
        await this.correctionModel.create(
          {
            answerKeyId: key.id,
            keyItemId: e.before.id,
            itemNumber: e.after.number,
            changes: e.changes,
            reason,
            madeByUserId: member.userId,
            madeByName: author?.displayName ?? 'a member',
            remarked: touched,
          },
          { transaction },
        ),
      );
    }
    for (const r of removed) {
      corrections.push(
        await this.correctionModel.create(
          {
            answerKeyId: key.id,
            keyItemId: null,
            itemNumber: r.number,
            changes: { removed: { from: r.prompt, to: null } },
            reason,
            madeByUserId: member.userId,
            madeByName: author?.displayName ?? 'a member',
            remarked: [],
          },
          { transaction },
        ),
      );
    }
    return { corrections, remarked };
  }
}

function diffItem(before: KeyItem, after: ItemFields): Record<string, FieldChange> {
  const changes: Record<string, FieldChange> = {};
  for (const field of ITEM_FIELDS) {
    const from = before[field];
    const to = after[field];
    if (JSON.stringify(from) !== JSON.stringify(to)) changes[field] = { from, to };
  }
  return changes;
}

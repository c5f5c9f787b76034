import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Cause, missKindOf, MissStatus } from '@workback/core';
import { Op, type Transaction } from 'sequelize';
import type { MemberContext } from '../common/member-context.js';
import { dedupe, diagnosisColumns, wordProblemColumns } from './miss-columns.js';
import { MissDiagnosesService } from './miss-diagnoses.service.js';
import { MissesService } from './misses.service.js';
import { Miss } from './models/miss.model.js';

/** Misses made from a sitting's marks (called by the sittings module, inside its transaction). */
@Injectable()
export class MarkedMissesService {
  constructor(
    @InjectModel(Miss) private readonly missModel: typeof Miss,
    private readonly misses: MissesService,
    private readonly diagnoses: MissDiagnosesService,
  ) {}

  /** The misses made from one sitting's marks, by key item. */
  async findForSitting(
    sittingId: number,
    transaction?: Transaction,
  ): Promise<Map<number, { id: number; status: MissStatus }>> {
    const rows = await this.missModel.findAll({
      where: { sittingId, keyItemId: { [Op.ne]: null } },
      attributes: ['id', 'keyItemId', 'status'],
      transaction,
    });
    return new Map(rows.map((m) => [m.keyItemId!, { id: m.id, status: m.status }]));
  }

  /** One miss for a wrong item: the item's prompt, the child's answer, the key's skills and lessons. */
  async createFromMark(
    member: MemberContext,
    input: {
      studentId: number;
      occurredOn: string;
      problem: string;
      answer: string;
      skills: readonly string[];
      revisit: readonly string[];
      sittingId: number;
      keyItemId: number;
      cause?: Cause;
    },
    transaction: Transaction,
  ): Promise<number> {
    const checked = this.diagnoses.checkAnswer(input.problem, input.answer, null);
    const miss = await this.missModel.create(
      {
        householdId: member.householdId,
        studentId: input.studentId,
        occurredOn: input.occurredOn,
        sittingId: input.sittingId,
        keyItemId: input.keyItemId,
        problem: input.problem,
        answer: input.answer,
        steps: null,
        explanation: '',
        cause: input.cause ?? Cause.unsure,
        note: '',
        status: MissStatus.logged,
        skills: dedupe(input.skills),
        revisit: dedupe(input.revisit),
        ...diagnosisColumns(checked),
        kind: missKindOf(input.problem),
        createdBy: member.userId,
        updatedBy: member.userId,
      },
      { transaction },
    );
    await this.diagnoses.writeRules(miss, checked, transaction, null, { newMiss: true });
    return miss.id;
  }

  /** The item is wrong again: the miss is open again (logged), with the answer now written. */
  async reopenFromMark(
    member: MemberContext,
    id: number,
    answer: string,
    transaction: Transaction,
  ) {
    const miss = await this.misses.findModel(member, id, transaction);
    await this.answerFromMark(member, id, answer, transaction);
    await miss.reload({ transaction });
    await miss.update({ status: MissStatus.logged, updatedBy: member.userId }, { transaction });
  }

  /** The child's answer for the item was changed on the marks: the miss takes it, re-diagnosed. */
  async answerFromMark(
    member: MemberContext,
    id: number,
    answer: string,
    transaction: Transaction,
  ) {
    const miss = await this.misses.findModel(member, id, transaction);
    if (miss.answer === answer) return;
    const checked = this.diagnoses.checkAnswer(miss.problem, answer, miss.steps);
    const word = { lines: miss.lines, linesCheck: miss.linesCheck, stage: miss.stage };
    await miss.update(
      {
        answer,
        ...diagnosisColumns(checked),
        ...wordProblemColumns(checked, word),
        updatedBy: member.userId,
      },
      { transaction },
    );
    await this.diagnoses.writeRules(miss, checked, transaction, word);
  }

  /** The item's mark turned right: resolved, the reason added to the note. */
  async resolveFromMark(
    member: MemberContext,
    id: number,
    reason: string,
    transaction: Transaction,
  ) {
    const miss = await this.misses.findModel(member, id, transaction);
    const line = `Resolved: ${reason}`.slice(0, 500);
    await miss.update(
      {
        status: MissStatus.resolved,
        note: miss.note ? `${miss.note}\n${line}` : line,
        updatedBy: member.userId,
      },
      { transaction },
    );
  }
}

import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Cause, MissStatus, PatternMiss } from '@workback/core';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { MemberContext } from '../common/member-context.js';
import { MissDiagnosesService } from './miss-diagnoses.service.js';
import { jsonOf, toMissSummary } from './miss-json.js';
import { missScope } from './miss-scope.js';
import { Miss } from './models/miss.model.js';
import { toPatternMiss } from './pattern-miss.js';

/** One student's misses as the review plans, patterns and the portfolio read them. */
@Injectable()
export class StudentMissesService {
  constructor(
    @InjectModel(Miss) private readonly missModel: typeof Miss,
    private readonly diagnoses: MissDiagnosesService,
  ) {}

  /**
   * For the patterns and review-plans modules: one student's misses with their full
   * diagnoses, oldest first, filtered by day range, status or ids (all scoped to the member).
   */
  async withDiagnoses(
    member: MemberContext,
    filter: {
      studentId: number;
      from?: string;
      to?: string;
      statuses?: readonly MissStatus[];
      ids?: readonly number[];
    },
    transaction?: Transaction,
  ) {
    const and: WhereOptions<Miss>[] = [missScope(member), { studentId: filter.studentId }];
    if (filter.from) and.push({ occurredOn: { [Op.gte]: filter.from } });
    if (filter.to) and.push({ occurredOn: { [Op.lte]: filter.to } });
    if (filter.statuses) and.push({ status: { [Op.in]: [...filter.statuses] } });
    if (filter.ids) and.push({ id: { [Op.in]: [...filter.ids] } });
    const rows = await this.missModel.findAll({
      where: { [Op.and]: and },
      order: [
        ['occurredOn', 'ASC'],
        ['id', 'ASC'],
      ],
      transaction,
    });
    const diagnoses = await this.diagnoses.diagnosesOf(
      rows.map((r) => r.id),
      transaction,
    );
    return rows.map((m) => ({
      ...toMissSummary(m),
      linesCheck: m.linesCheck,
      diagnosis: diagnoses.get(m.id) ?? null,
    }));
  }

  /**
   * One student's misses as the pattern maths reads them, from the row's own columns: the
   * rule ids (a pair's `id` joins its `ids` with `+`) and facts, without the stored diagnosis.
   */
  async patternMisses(
    member: MemberContext,
    filter: { studentId: number; from?: string; to?: string },
  ): Promise<PatternMiss[]> {
    const and: WhereOptions<Miss>[] = [missScope(member), { studentId: filter.studentId }];
    if (filter.from) and.push({ occurredOn: { [Op.gte]: filter.from } });
    if (filter.to) and.push({ occurredOn: { [Op.lte]: filter.to } });
    const rows = (await this.missModel.findAll({
      attributes: [
        'id',
        'occurredOn',
        'cause',
        'skills',
        'problem',
        'answer',
        'notCheckedReason',
        'ruleIds',
        'facts',
        'lines',
      ],
      where: { [Op.and]: and },
      order: [
        ['occurredOn', 'ASC'],
        ['id', 'ASC'],
      ],
      // Plain rows, not model instances: read once for the maths, never saved.
      raw: true,
    })) as unknown as Record<string, unknown>[];
    return rows.map((m) => {
      const ruleIds = jsonOf<string[]>(m.ruleIds, []);
      return toPatternMiss(
        {
          id: m.id as number,
          occurredOn: m.occurredOn as string,
          cause: m.cause as Cause,
          skills: jsonOf<string[]>(m.skills, []),
          problem: m.problem as string,
          answer: m.answer as string,
        },
        // A word problem the engine cannot read counts its first wrong line's rules.
        m.notCheckedReason === null || jsonOf<string[] | null>(m.lines, null) !== null
          ? {
              rules: ruleIds.map((id) => ({ id, ids: id.split('+') })),
              facts: jsonOf<Miss['facts']>(m.facts, []),
            }
          : null,
      );
    });
  }
}

import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Cause, MissStatus, PatternMiss } from '@workback/core';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { allQueries } from '../database/in-transaction.js';
import { placeholders, selectList, SqlReader, type SqlParam } from '../database/sql-reader.js';
import { MissDiagnosesService } from './miss-diagnoses.service.js';
import {
  fromRawRow,
  jsonOf,
  SUMMARY_ATTRIBUTES,
  toMissSummary,
  type RawMissRow,
} from './miss-json.js';
import { missScopeSql } from './miss-scope.js';
import { Miss } from './models/miss.model.js';
import { toPatternMiss } from './pattern-miss.js';

const WITH_DIAGNOSES_COLUMNS = selectList(Miss, [...SUMMARY_ATTRIBUTES, 'linesCheck']);
const PATTERN_COLUMNS = selectList(Miss, [
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
]);

interface StudentMissFilter {
  studentId: number;
  from?: string;
  to?: string;
}

/** The member's misses of one student over a day range, as SQL conditions to add to. */
function filterSql(member: MemberContext, filter: StudentMissFilter) {
  const scope = missScopeSql(member);
  const and = [scope.sql];
  const params: SqlParam[] = [...scope.params];
  const add = (sql: string, ...values: SqlParam[]) => {
    and.push(sql);
    params.push(...values);
  };
  add('"student_id" = ?', filter.studentId);
  if (filter.from) add('"occurred_on" >= ?', filter.from);
  if (filter.to) add('"occurred_on" <= ?', filter.to);
  // An empty list matches nothing (PostgreSQL refuses `IN ()`).
  const addIn = (column: string, values: readonly SqlParam[]) =>
    values.length === 0
      ? add('1 = 0')
      : add(`${column} IN (${placeholders(values.length)})`, ...values);
  return { addIn, params, sql: () => and.map((c) => `(${c})`).join(' AND ') };
}

/** One student's misses as the review plans, patterns and the portfolio read them. */
@Injectable()
export class StudentMissesService {
  constructor(
    private readonly reader: SqlReader,
    private readonly diagnoses: MissDiagnosesService,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  /**
   * For the patterns and review-plans modules: one student's misses with their full
   * diagnoses, oldest first, filtered by day range, status or ids (all scoped to the member).
   */
  async withDiagnoses(
    member: MemberContext,
    filter: StudentMissFilter & { statuses?: readonly MissStatus[]; ids?: readonly number[] },
    transaction?: Transaction,
  ) {
    const where = filterSql(member, filter);
    if (filter.statuses) where.addIn('"status"', filter.statuses);
    if (filter.ids) where.addIn('"id"', filter.ids);
    // Plain rows (SqlReader): read for plans, prints and the portfolio, never saved from here.
    const read = () =>
      this.reader.rows<RawMissRow & { linesCheck: unknown }>(
        `SELECT ${WITH_DIAGNOSES_COLUMNS()} FROM "misses" WHERE ${where.sql()}
         ORDER BY "occurred_on", "id"`,
        where.params,
        transaction,
      );
    // Misses asked for by id have their diagnoses read beside them where the database allows
    // (each row the member may see takes its own); otherwise the diagnoses wait for the rows' ids.
    const [rows, byId] = await allQueries(this.sequelize, transaction, [
      read,
      async () => (filter.ids ? this.diagnoses.diagnosesOf(filter.ids, transaction) : null),
    ]);
    const diagnoses =
      byId ??
      (await this.diagnoses.diagnosesOf(
        rows.map((r) => r.id as number),
        transaction,
      ));
    return rows.map((row) => {
      const m = fromRawRow(row);
      return {
        ...toMissSummary(m),
        linesCheck: jsonOf<Miss['linesCheck']>(row.linesCheck, null),
        diagnosis: diagnoses.get(m.id) ?? null,
      };
    });
  }

  /**
   * One student's misses as the pattern maths reads them, from the row's own columns: the
   * rule ids (a pair's `id` joins its `ids` with `+`) and facts, without the stored diagnosis.
   */
  async patternMisses(member: MemberContext, filter: StudentMissFilter): Promise<PatternMiss[]> {
    const where = filterSql(member, filter);
    // Plain rows, not model instances: read once for the maths, never saved.
    const rows = await this.reader.rows<Record<string, unknown>>(
      `SELECT ${PATTERN_COLUMNS()} FROM "misses" WHERE ${where.sql()} ORDER BY "occurred_on", "id"`,
      where.params,
    );
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

import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import {
  checkLines,
  type CheckedLines,
  type Diagnosis,
  type InterviewStage,
  type WrittenSteps,
} from '@workback/core';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { allQueries } from '../database/in-transaction.js';
import { insertThroughModel, type NewRows } from '../database/inserts.service.js';
import { placeholders, SqlReader } from '../database/sql-reader.js';
import { DiagnoseService, type Checked } from '../diagnose/diagnose.service.js';
import { MAX_LINE_LENGTH } from './dto/create-miss.dto.js';
import { firstWrongLine, ruleIdsOf, type WordProblem } from './miss-columns.js';
import { jsonOf } from './miss-json.js';
import { MissDiagnosis } from './models/miss-diagnosis.model.js';
import { MissRule } from './models/miss-rule.model.js';
import type { Miss } from './models/miss.model.js';

/** What the engine makes of a miss (its working, a word problem's lines) and the rows that keep it. */
@Injectable()
export class MissDiagnosesService {
  constructor(
    @InjectModel(MissRule) private readonly ruleModel: typeof MissRule,
    @InjectModel(MissDiagnosis) private readonly diagnosisModel: typeof MissDiagnosis,
    private readonly diagnoser: DiagnoseService,
    private readonly reader: SqlReader,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  check(problem: string, answer: string, steps: WrittenSteps | null): Checked {
    const checked = this.diagnoser.check(problem, answer, steps);
    // Steps are structured input: if the engine cannot read them the request is wrong, not the problem.
    if (!checked.checked && checked.part === 'steps') throw fieldsError({ steps: checked.reason });
    return checked;
  }

  /**
   * A word problem's lines checked one by one (null when there are none). A line the engine
   * cannot read is refused like unreadable steps, naming it (`lines.2` is the third line);
   * an engine failure keeps the lines unchecked rather than losing the entry.
   */
  wordProblem(lines: string[] | null, stage: InterviewStage | null): WordProblem {
    if (!lines || lines.length === 0) return { lines: null, linesCheck: null, stage };
    const long = lines.findIndex((l) => [...l].length > MAX_LINE_LENGTH);
    if (long >= 0) {
      throw fieldsError({
        [`lines.${long}`]: `line ${long + 1} must be at most ${MAX_LINE_LENGTH} characters`,
      });
    }
    let linesCheck: CheckedLines;
    try {
      linesCheck = checkLines(lines);
    } catch {
      return { lines, linesCheck: null, stage };
    }
    if (!linesCheck.ok) {
      throw fieldsError({ [`lines.${linesCheck.line - 1}`]: linesCheck.error.message });
    }
    return { lines, linesCheck, stage };
  }

  /**
   * The diagnosis row and the rule rows of a miss, replaced by the new findings. `newMiss`: the
   * miss was made in this transaction, so there are none to remove first.
   */
  async writeRules(
    miss: Miss,
    checked: Checked,
    transaction: Transaction,
    word: WordProblem | null = null,
    { newMiss = false }: { newMiss?: boolean } = {},
  ) {
    if (!newMiss) {
      await this.diagnosisModel.destroy({ where: { missId: miss.id }, transaction });
      await this.ruleModel.destroy({ where: { missId: miss.id }, transaction });
    }
    const [diagnosis, rules] = this.newRows(miss.id, miss.householdId, checked, word);
    // Both sent at once where the database allows: neither waits on the other's answer.
    await allQueries(this.sequelize, transaction, [
      () => insertThroughModel(diagnosis, transaction),
      () => insertThroughModel(rules, transaction),
    ]);
  }

  /** The diagnosis row (when the engine read the problem) and the rule rows of a miss. */
  newRows(
    missId: number,
    householdId: number,
    checked: Checked,
    word: WordProblem | null = null,
  ): [NewRows<MissDiagnosis>, NewRows<MissRule>] {
    const counted = checked.checked ? checked.diagnosis : firstWrongLine(word?.linesCheck ?? null);
    const ids = counted ? ruleIdsOf(counted) : [];
    return [
      {
        model: this.diagnosisModel,
        values: checked.checked ? [{ missId, diagnosis: checked.diagnosis }] : [],
      },
      { model: this.ruleModel, values: ids.map((ruleId) => ({ missId, ruleId, householdId })) },
    ];
  }

  /** The engine's findings as it checks a marked item: no written steps, never refused. */
  checkAnswer(problem: string, answer: string, steps: WrittenSteps | null = null): Checked {
    return this.diagnoser.check(problem, answer, steps);
  }

  /** The stored full diagnosis of one miss (null when the engine could not read it). */
  async diagnosisOf(missId: number): Promise<Diagnosis | null> {
    // Read on every opened miss: straight through the driver (SqlReader), not as a model.
    const [row] = await this.reader.rows<{ diagnosis: string | null }>(
      'SELECT "diagnosis" FROM "miss_diagnoses" WHERE "miss_id" = ?',
      [missId],
    );
    return row ? jsonOf<Diagnosis | null>(row.diagnosis, null) : null;
  }

  /** The stored full diagnoses of these misses, by miss id. */
  async diagnosesOf(missIds: readonly number[], transaction?: Transaction) {
    if (missIds.length === 0) return new Map<number, Diagnosis | null>();
    const rows = await this.reader.rows<{ missId: number; diagnosis: string | null }>(
      `SELECT "miss_id" AS "missId", "diagnosis" FROM "miss_diagnoses"
       WHERE "miss_id" IN (${placeholders(missIds.length)})`,
      missIds,
      transaction,
    );
    return new Map(rows.map((d) => [d.missId, jsonOf<Diagnosis | null>(d.diagnosis, null)]));
  }
}

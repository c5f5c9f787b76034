import type { CheckUpReading, CheckUpProblem, MergedCandidate } from '@workback/core';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { AnswerKey } from '../../answer-keys/models/answer-key.model.js';
import { jsonColumn } from '../../common/json-column.js';
import { Household } from '../../households/models/household.model.js';
import { Sitting } from '../../sittings/models/sitting.model.js';
import { Student } from '../../students/models/student.model.js';

/** The planned sheet as stored: every hypothesis and the answer each writes on each problem. */
export interface StoredSheet {
  readonly operation: string;
  readonly hypotheses: readonly string[];
  readonly problems: readonly CheckUpProblem[];
  readonly merged: readonly MergedCandidate[];
}

@Table({ tableName: 'check_ups', underscored: true })
export class CheckUp extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @ForeignKey(() => Student)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare studentId: number;

  @ForeignKey(() => AnswerKey)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare answerKeyId: number;

  @ForeignKey(() => Sitting)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare sittingId: number | null;

  /** The rules the parent asked to tell apart, as asked. */
  @Column(jsonColumn('ruleIds', []))
  declare ruleIds: string[];

  @Column(jsonColumn('sheet', null))
  declare sheet: StoredSheet;

  /** What the child's answers said, and the answers; null until the check-up is taken. */
  @Column(jsonColumn('reading', null, true))
  declare reading: (CheckUpReading & { answers: (string | null)[] }) | null;

  @BelongsTo(() => Student)
  declare student?: Student;

  declare createdAt: Date;
  declare updatedAt: Date;
}

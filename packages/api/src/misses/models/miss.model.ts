import type {
  Cause,
  CheckedLines,
  InterviewStage,
  MissKind,
  MissStatus,
  StoredDiagnosis,
  WrittenSteps,
} from '@workback/core';
import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { jsonColumn } from '../../common/json-column.js';
import { Household } from '../../households/models/household.model.js';
import { Student } from '../../students/models/student.model.js';
import { User } from '../../users/models/user.model.js';

/** One missed problem: what was asked, what the child wrote and said, the cause, the diagnosis. */
@Table({ tableName: 'misses', underscored: true })
export class Miss extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @ForeignKey(() => Student)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare studentId: number;

  @Column({ type: DataType.DATEONLY, allowNull: false })
  declare occurredOn: string;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare sittingId: number | null;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare keyItemId: number | null;

  @Column({ type: DataType.STRING(200), allowNull: false })
  declare problem: string;

  @Column({ type: DataType.STRING(80), allowNull: false })
  declare answer: string;

  @Column(jsonColumn<WrittenSteps | null>('steps', null, true))
  declare steps: WrittenSteps | null;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  declare explanation: string;

  /** A word problem's number sentences as the child wrote them, one per line (migration 0012). */
  @Column(jsonColumn<string[] | null>('lines', null, true))
  declare lines: string[] | null;

  /** checkLines' reading of `lines` when they were saved; the rule ids below follow from it. */
  @Column(jsonColumn<CheckedLines | null>('linesCheck', null, true))
  declare linesCheck: CheckedLines | null;

  /** The interview stage where the parent found the word problem went wrong (Newman 1977). */
  @Column({ type: DataType.STRING(16), allowNull: true })
  declare stage: InterviewStage | null;

  /** The notebook's kind (`missKindOf`): whole, fraction, decimal, money, time, word or other (migration 0013). */
  @Column({ type: DataType.STRING(16), allowNull: false, defaultValue: 'other' })
  declare kind: MissKind;

  @Column({ type: DataType.STRING(16), allowNull: false })
  declare cause: Cause;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  declare note: string;

  @Column({ type: DataType.STRING(16), allowNull: false })
  declare status: MissStatus;

  @Column(jsonColumn<string[]>('skills', []))
  declare skills: string[];

  @Column(jsonColumn<string[]>('revisit', []))
  declare revisit: string[];

  @Column({ type: DataType.STRING(40), allowNull: true })
  declare engineVersion: string | null;

  @Column({ type: DataType.STRING(300), allowNull: true })
  declare notCheckedReason: string | null;

  @Column({ type: DataType.STRING(80), allowNull: true })
  declare expected: string | null;

  @Column({ type: DataType.BOOLEAN, allowNull: true })
  declare correct: boolean | null;

  @Column(jsonColumn<string[]>('ruleIds', []))
  declare ruleIds: string[];

  /** The diagnosis's wrong basic facts, kept on the row for the pattern maths. */
  @Column(jsonColumn<StoredDiagnosis['facts']>('facts', []))
  declare facts: StoredDiagnosis['facts'];

  @Column({ type: DataType.STRING(16), allowNull: true })
  declare suggestedCause: Cause | null;

  /** The client's Idempotency-Key, unique per household (migration 0008). */
  @Column({ type: DataType.STRING(100), allowNull: true })
  declare idempotencyKey: string | null;

  /** SHA-256 of the fields and photos sent with that key, to refuse the key reused for other content. */
  @Column({ type: DataType.STRING(64), allowNull: true })
  declare requestDigest: string | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare createdBy: number | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare updatedBy: number | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

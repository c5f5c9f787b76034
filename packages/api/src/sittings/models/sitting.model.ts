import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { AnswerKey } from '../../answer-keys/models/answer-key.model.js';
import { Household } from '../../households/models/household.model.js';
import { Student } from '../../students/models/student.model.js';
import type { TimeOfDay } from '../time-of-day.js';

@Table({ tableName: 'sittings', underscored: true })
export class Sitting extends Model {
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

  /** Local clock time as the family typed it: `2026-03-02T09:30`. */
  @Column({ type: DataType.STRING(16), allowNull: false })
  declare startedAt: string;

  @Column({ type: DataType.STRING(16), allowNull: false })
  declare timeOfDay: TimeOfDay;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare minutes: number | null;

  @Column({ type: DataType.BOOLEAN, allowNull: true })
  declare rested: boolean | null;

  @Column({ type: DataType.BOOLEAN, allowNull: true })
  declare afterMeal: boolean | null;

  @Column({ type: DataType.STRING(300), allowNull: true })
  declare note: string | null;

  @BelongsTo(() => AnswerKey)
  declare answerKey?: AnswerKey;

  declare createdAt: Date;
  declare updatedAt: Date;
}

import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Course } from '../../curriculum/models/course.model.js';
import { Household } from '../../households/models/household.model.js';

/** `check-up`: a sheet Workback planned to tell a child's possible explanations apart. */
export const KEY_KINDS = ['worksheet', 'review', 'assessment', 'check-up'] as const;
export type KeyKind = (typeof KEY_KINDS)[number];

@Table({ tableName: 'answer_keys', underscored: true })
export class AnswerKey extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @ForeignKey(() => Course)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare courseId: number | null;

  @Column({ type: DataType.STRING(120), allowNull: false })
  declare title: string;

  @Column({ type: DataType.STRING(16), allowNull: false })
  declare kind: KeyKind;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare lessonNumber: number | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

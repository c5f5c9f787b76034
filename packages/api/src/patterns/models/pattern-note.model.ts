import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Household } from '../../households/models/household.model.js';
import { Student } from '../../students/models/student.model.js';
import { User } from '../../users/models/user.model.js';

/** A parent's or tutor's remark on one of a student's patterns (`rule:…`, `fact:…`, `skill:…`, `group:…`). */
@Table({ tableName: 'pattern_notes', underscored: true })
export class PatternNote extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @ForeignKey(() => Student)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare studentId: number;

  @Column({ type: DataType.STRING(120), allowNull: false })
  declare patternKey: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  declare body: string;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare authorId: number | null;

  @BelongsTo(() => User, { onDelete: 'SET NULL' })
  declare author?: User | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

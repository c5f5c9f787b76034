import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { jsonColumn } from '../../common/json-column.js';
import { Household } from '../../households/models/household.model.js';
import { Student } from '../../students/models/student.model.js';
import { User } from '../../users/models/user.model.js';

export type ReviewPlanStatus = 'open' | 'done';

/** A review for one student on a calmer day: lessons, fact families, practice, misses to re-work. */
@Table({ tableName: 'review_plans', underscored: true })
export class ReviewPlan extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @ForeignKey(() => Student)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare studentId: number;

  @Column({ type: DataType.DATEONLY, allowNull: false })
  declare scheduledFor: string;

  @Column({ type: DataType.STRING(16), allowNull: false })
  declare status: ReviewPlanStatus;

  @Column(jsonColumn<string[]>('covers', []))
  declare covers: string[];

  @Column({ type: DataType.STRING(400), allowNull: false, defaultValue: '' })
  declare lessonsText: string;

  @Column(jsonColumn<string[]>('notes', []))
  declare notes: string[];

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare createdBy: number | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

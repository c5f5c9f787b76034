import type { PlanItemDraft, PlanItemKind } from '@workback/core';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { jsonColumn } from '../../common/json-column.js';
import { User } from '../../users/models/user.model.js';
import { ReviewPlan } from './review-plan.model.js';

/** One line of a plan's checklist; its payload is the core builder's item as made. */
@Table({ tableName: 'review_plan_items', underscored: true })
export class ReviewPlanItem extends Model {
  declare id: number;

  @ForeignKey(() => ReviewPlan)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare planId: number;

  @BelongsTo(() => ReviewPlan, { onDelete: 'CASCADE' })
  declare plan?: ReviewPlan;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare position: number;

  @Column({ type: DataType.STRING(16), allowNull: false })
  declare kind: PlanItemKind;

  @Column({ type: DataType.STRING(120), allowNull: false })
  declare key: string;

  @Column({ type: DataType.STRING(300), allowNull: false })
  declare title: string;

  @Column(jsonColumn<PlanItemDraft['payload']>('payload', null as never))
  declare payload: PlanItemDraft['payload'];

  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: false })
  declare done: boolean;

  @Column({ type: DataType.DATE, allowNull: true })
  declare doneAt: Date | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare doneBy: number | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

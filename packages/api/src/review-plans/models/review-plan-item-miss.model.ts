import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Miss } from '../../misses/models/miss.model.js';
import { ReviewPlanItem } from './review-plan-item.model.js';

/** Which misses a checklist line covers: when every line covering a miss is done, it is resolved. */
@Table({ tableName: 'review_plan_item_misses', underscored: true, timestamps: false })
export class ReviewPlanItemMiss extends Model {
  @ForeignKey(() => ReviewPlanItem)
  @Column({ type: DataType.INTEGER, allowNull: false, primaryKey: true })
  declare itemId: number;

  @ForeignKey(() => Miss)
  @Column({ type: DataType.INTEGER, allowNull: false, primaryKey: true })
  declare missId: number;
}

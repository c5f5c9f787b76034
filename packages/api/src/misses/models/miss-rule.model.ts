import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Miss } from './miss.model.js';

/** A rule id a miss's diagnosis names (each id of a pair too), for indexed `rule=` filters. */
@Table({ tableName: 'miss_rules', underscored: true, timestamps: false })
export class MissRule extends Model {
  @ForeignKey(() => Miss)
  @Column({ type: DataType.INTEGER, allowNull: false, primaryKey: true })
  declare missId: number;

  @Column({ type: DataType.STRING(80), allowNull: false, primaryKey: true })
  declare ruleId: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;
}

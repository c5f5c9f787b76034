import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Household } from '../../households/models/household.model.js';

@Table({ tableName: 'courses', underscored: true })
export class Course extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @Column({ type: DataType.STRING(80), allowNull: false })
  declare name: string;

  @Column({ type: DataType.STRING(40), allowNull: true })
  declare level: string | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

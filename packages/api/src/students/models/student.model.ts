import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Household } from '../../households/models/household.model.js';

@Table({ tableName: 'students', underscored: true })
export class Student extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @Column({ type: DataType.STRING(40), allowNull: false })
  declare name: string;

  @Column({ type: DataType.STRING(4), allowNull: false })
  declare gradeLevel: string;

  declare createdAt: Date;
  declare updatedAt: Date;
}

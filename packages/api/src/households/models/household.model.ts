import { Column, DataType, Model, Table } from 'sequelize-typescript';

@Table({ tableName: 'households', underscored: true })
export class Household extends Model {
  declare id: number;

  @Column({ type: DataType.STRING(80), allowNull: false })
  declare name: string;

  declare createdAt: Date;
  declare updatedAt: Date;
}

import { Column, DataType, Model, Table } from 'sequelize-typescript';

@Table({ tableName: 'users', underscored: true })
export class User extends Model {
  declare id: number;

  @Column({ type: DataType.STRING(254), allowNull: false, unique: true })
  declare email: string;

  @Column({ type: DataType.STRING(80), allowNull: false })
  declare displayName: string;

  @Column({ type: DataType.STRING, allowNull: false })
  declare passwordHash: string;

  declare createdAt: Date;
  declare updatedAt: Date;
}

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

  /** When the owner of the address opened the link mailed to it; null until then. */
  @Column({ type: DataType.DATE, allowNull: true })
  declare emailVerifiedAt: Date | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

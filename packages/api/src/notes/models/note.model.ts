import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Miss } from '../../misses/models/miss.model.js';
import { User } from '../../users/models/user.model.js';

/** A remark on a miss by a parent or tutor. */
@Table({ tableName: 'notes', underscored: true })
export class Note extends Model {
  declare id: number;

  @ForeignKey(() => Miss)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare missId: number;

  @BelongsTo(() => Miss, { onDelete: 'CASCADE' })
  declare miss?: Miss;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare authorId: number | null;

  @BelongsTo(() => User, { onDelete: 'SET NULL' })
  declare author?: User | null;

  @Column({ type: DataType.TEXT, allowNull: false })
  declare body: string;

  declare createdAt: Date;
  declare updatedAt: Date;
}

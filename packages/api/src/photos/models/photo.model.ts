import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Miss } from '../../misses/models/miss.model.js';

/** A photo of a miss: the re-encoded display image and its thumbnail, both in PhotoStorage. */
@Table({ tableName: 'photos', underscored: true, updatedAt: false })
export class Photo extends Model {
  declare id: number;

  @ForeignKey(() => Miss)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare missId: number;

  @BelongsTo(() => Miss, { onDelete: 'CASCADE' })
  declare miss?: Miss;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare position: number;

  @Column({ type: DataType.STRING(32), allowNull: false })
  declare contentType: string;

  @Column({ type: DataType.STRING(100), allowNull: false })
  declare storageKey: string;

  @Column({ type: DataType.STRING(100), allowNull: false })
  declare thumbKey: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare width: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare height: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare bytes: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare thumbWidth: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare thumbHeight: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare thumbBytes: number;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare createdBy: number | null;

  declare createdAt: Date;
}

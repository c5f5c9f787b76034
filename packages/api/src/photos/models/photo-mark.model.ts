import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Photo } from './photo.model.js';

/** A pin on a photo: x and y as fractions of the image's width and height (0 to 1). */
@Table({ tableName: 'photo_marks', underscored: true, updatedAt: false })
export class PhotoMark extends Model {
  declare id: number;

  @ForeignKey(() => Photo)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare photoId: number;

  @Column({ type: DataType.REAL, allowNull: false })
  declare x: number;

  @Column({ type: DataType.REAL, allowNull: false })
  declare y: number;

  @Column({ type: DataType.STRING(40), allowNull: true })
  declare label: string | null;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare createdBy: number | null;

  declare createdAt: Date;
}

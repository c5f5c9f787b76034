import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { KeyItem } from '../../answer-keys/models/key-item.model.js';
import { Sitting } from './sitting.model.js';

/** One item of a sitting marked right or wrong, with the child's answer when it was typed. */
@Table({ tableName: 'sitting_marks', underscored: true })
export class SittingMark extends Model {
  declare id: number;

  @ForeignKey(() => Sitting)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare sittingId: number;

  @ForeignKey(() => KeyItem)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare keyItemId: number;

  @Column({ type: DataType.BOOLEAN, allowNull: false })
  declare correct: boolean;

  @Column({ type: DataType.STRING(80), allowNull: true })
  declare answer: string | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

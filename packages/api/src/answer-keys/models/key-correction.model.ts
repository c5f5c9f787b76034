import { jsonColumn } from '../../common/json-column.js';
import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../../users/models/user.model.js';
import { AnswerKey } from './answer-key.model.js';
import { KeyItem } from './key-item.model.js';

export type FieldChange = { from: unknown; to: unknown };

/** One edit of a key item after sittings were marked against it: what, why, when, who. */
@Table({ tableName: 'key_corrections', underscored: true, updatedAt: false })
export class KeyCorrection extends Model {
  declare id: number;

  @ForeignKey(() => AnswerKey)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare answerKeyId: number;

  @ForeignKey(() => KeyItem)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare keyItemId: number | null;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare itemNumber: number;

  @Column(jsonColumn('changes', {}))
  declare changes: Record<string, FieldChange>;

  @Column({ type: DataType.STRING(300), allowNull: false })
  declare reason: string;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare madeByUserId: number | null;

  @Column({ type: DataType.STRING(80), allowNull: false })
  declare madeByName: string;

  /** Ids of the sittings whose marks this correction changed. */
  @Column(jsonColumn('remarked', []))
  declare remarked: number[];

  declare createdAt: Date;
}

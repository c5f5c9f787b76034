import { jsonColumn } from '../../common/json-column.js';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { AnswerKey } from './answer-key.model.js';

@Table({ tableName: 'key_items', underscored: true })
export class KeyItem extends Model {
  declare id: number;

  @ForeignKey(() => AnswerKey)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare answerKeyId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare number: number;

  @Column({ type: DataType.STRING(200), allowNull: false })
  declare prompt: string;

  @Column({ type: DataType.STRING(80), allowNull: false })
  declare answer: string;

  @Column(jsonColumn('skills', []))
  declare skills: string[];

  /** Lessons to revisit as written: single numbers and ranges, `['12', '31-33']`. */
  @Column(jsonColumn('revisit', []))
  declare revisit: string[];

  /** Fact families to practise, e.g. `['sixes']`. */
  @Column(jsonColumn('facts', []))
  declare facts: string[];

  @BelongsTo(() => AnswerKey)
  declare answerKey?: AnswerKey;

  declare createdAt: Date;
  declare updatedAt: Date;
}

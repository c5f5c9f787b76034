import { jsonColumn } from '../../common/json-column.js';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Course } from './course.model.js';

@Table({ tableName: 'lessons', underscored: true })
export class Lesson extends Model {
  declare id: number;

  @ForeignKey(() => Course)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare courseId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare number: number;

  @Column({ type: DataType.STRING(120), allowNull: false })
  declare title: string;

  @Column(jsonColumn('skills', []))
  declare skills: string[];

  @BelongsTo(() => Course)
  declare course?: Course;

  declare createdAt: Date;
  declare updatedAt: Date;
}

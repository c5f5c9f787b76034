import type { Diagnosis } from '@workback/core';
import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { jsonColumn } from '../../common/json-column.js';
import { Miss } from './miss.model.js';

/** The engine's full Diagnosis JSON for a miss, kept apart from the list columns. */
@Table({ tableName: 'miss_diagnoses', underscored: true, timestamps: false })
export class MissDiagnosis extends Model {
  @ForeignKey(() => Miss)
  @Column({ type: DataType.INTEGER, allowNull: false, primaryKey: true })
  declare missId: number;

  @Column(jsonColumn<Diagnosis>('diagnosis', null as unknown as Diagnosis))
  declare diagnosis: Diagnosis;
}

import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Student } from '../../students/models/student.model.js';
import { Membership } from './membership.model.js';

/** Which students a tutor membership may see. Owners and parents see all. */
@Table({ tableName: 'student_grants', underscored: true, updatedAt: false })
export class StudentGrant extends Model {
  @ForeignKey(() => Membership)
  @Column({ type: DataType.INTEGER, allowNull: false, primaryKey: true })
  declare membershipId: number;

  @ForeignKey(() => Student)
  @Column({ type: DataType.INTEGER, allowNull: false, primaryKey: true })
  declare studentId: number;

  declare createdAt: Date;
}

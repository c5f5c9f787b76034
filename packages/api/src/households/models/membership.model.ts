import type { Role } from '@workback/core';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../../users/models/user.model.js';
import { Household } from './household.model.js';

@Table({ tableName: 'memberships', underscored: true })
export class Membership extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare userId: number;

  @Column({ type: DataType.STRING(16), allowNull: false })
  declare role: Role;

  @BelongsTo(() => Household)
  declare household?: Household;

  @BelongsTo(() => User)
  declare user?: User;

  declare createdAt: Date;
  declare updatedAt: Date;
}

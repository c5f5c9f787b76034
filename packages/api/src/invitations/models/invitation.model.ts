import type { Role } from '@workback/core';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { Household } from '../../households/models/household.model.js';
import { User } from '../../users/models/user.model.js';

@Table({ tableName: 'invitations', underscored: true })
export class Invitation extends Model {
  declare id: number;

  @ForeignKey(() => Household)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare householdId: number;

  @Column({ type: DataType.STRING(254), allowNull: false })
  declare email: string;

  @Column({ type: DataType.STRING(16), allowNull: false })
  declare role: Role;

  @Column({
    type: DataType.TEXT,
    allowNull: false,
    get(this: Invitation): number[] {
      const raw: unknown = this.getDataValue('studentIds');
      return typeof raw === 'string' ? (JSON.parse(raw) as number[]) : [];
    },
    set(this: Invitation, value: readonly number[]) {
      this.setDataValue('studentIds', JSON.stringify(value));
    },
  })
  declare studentIds: number[];

  @Column({ type: DataType.STRING(64), allowNull: false, unique: true })
  declare tokenHash: string;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare invitedById: number | null;

  @Column({ type: DataType.DATE, allowNull: false })
  declare expiresAt: Date;

  @Column({ type: DataType.DATE, allowNull: true })
  declare acceptedAt: Date | null;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare acceptedById: number | null;

  @BelongsTo(() => Household)
  declare household?: Household;

  @BelongsTo(() => User, 'invitedById')
  declare invitedBy?: User | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}

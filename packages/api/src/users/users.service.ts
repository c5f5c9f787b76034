import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { User } from './models/user.model.js';

@Injectable()
export class UsersService {
  constructor(@InjectModel(User) private readonly userModel: typeof User) {}

  findByEmail(email: string): Promise<User | null> {
    return this.userModel.findOne({ where: { email: normalizeEmail(email) } });
  }

  findById(id: number): Promise<User | null> {
    return this.userModel.findByPk(id);
  }

  create(
    input: { email: string; displayName: string; passwordHash: string; emailVerifiedAt?: Date },
    transaction?: Transaction,
  ): Promise<User> {
    return this.userModel.create({ ...input, email: normalizeEmail(input.email) }, { transaction });
  }

  async setPasswordHash(
    id: number,
    passwordHash: string,
    transaction?: Transaction,
  ): Promise<void> {
    await this.userModel.update({ passwordHash }, { where: { id }, transaction });
  }

  /** Marks the address as verified (once: a later call keeps the first time). */
  async markEmailVerified(id: number, transaction?: Transaction): Promise<void> {
    await this.userModel.update(
      { emailVerifiedAt: new Date() },
      { where: { id, emailVerifiedAt: null }, transaction },
    );
  }
}

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}

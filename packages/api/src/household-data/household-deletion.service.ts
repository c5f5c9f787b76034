import { rm } from 'node:fs/promises';
import path from 'node:path';
import { Inject, Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection } from '@nestjs/sequelize';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import type { AppConfig } from '../config/app.config.js';
import { HouseholdsService } from '../households/households.service.js';
import { MemberCache } from '../households/member-cache.js';
import { SessionStoreService } from '../sessions/session-store.service.js';
import { PHOTO_STORAGE, type PhotoStorage } from '../storage/photo-storage.js';
import { HouseholdDataService } from './household-data.service.js';
import { deletionOrder, quoteIdentifier as q } from './household-tables.js';

export interface DeletionSummary {
  householdId: number;
  rows: Record<string, number>;
  files: number;
  accountsClosed: number;
  /** Whether the account that asked was closed too (it had no other household). */
  yourAccountClosed: boolean;
}

/** A household deleted whole at its owner's word: rows, files, and accounts left with no household. */
@Injectable()
export class HouseholdDeletionService {
  private readonly logger = new Logger(HouseholdDeletionService.name);
  private readonly photosDir: string;
  private readonly adminEmails: readonly string[];

  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly data: HouseholdDataService,
    private readonly households: HouseholdsService,
    private readonly memberCache: MemberCache,
    private readonly sessions: SessionStoreService,
    @Inject(PHOTO_STORAGE) private readonly storage: PhotoStorage,
    config: ConfigService,
  ) {
    const app = config.getOrThrow<AppConfig>('app');
    this.photosDir = path.resolve(app.photosDir);
    this.adminEmails = app.adminEmails;
  }

  /**
   * Deletes the household after a typed confirmation: all its rows in one
   * transaction (children first), then its files; accounts left with no
   * household are closed and their sessions ended.
   */
  async deleteHousehold(member: MemberContext, confirm: string): Promise<DeletionSummary> {
    const household = await this.households.findCurrent(member);
    if (confirm.trim() !== household.name.trim()) {
      throw fieldsError({
        confirm: `type the household’s name exactly, “${household.name}”, to confirm`,
      });
    }
    const snap = await this.data.snapshot(member);
    const rows: Record<string, number> = {};
    const closed = await this.sequelize.transaction(async (transaction) => {
      const memberIds = (
        await this.data.select<{ user_id: number }>(
          'SELECT user_id FROM memberships WHERE household_id = ?',
          member.householdId,
          transaction,
        )
      ).map((r) => r.user_id);
      for (const table of deletionOrder(await this.data.householdTables(transaction))) {
        rows[table.name] = await this.sequelize.query(
          `DELETE FROM ${q(table.name)} WHERE ${table.where}`,
          { replacements: [member.householdId], type: QueryTypes.BULKDELETE, transaction },
        );
      }
      const orphans = memberIds.length
        ? await this.sequelize.query<{ id: number; email: string }>(
            `SELECT id, email FROM users WHERE id IN (${memberIds.map(() => '?').join(', ')})
             AND id NOT IN (SELECT user_id FROM memberships)`,
            { replacements: memberIds, type: QueryTypes.SELECT, transaction },
          )
        : [];
      const closing = orphans.filter((u) => !this.adminEmails.includes(u.email)).map((u) => u.id);
      if (closing.length) {
        await this.sequelize.query(
          `DELETE FROM users WHERE id IN (${closing.map(() => '?').join(', ')})`,
          { replacements: closing, transaction },
        );
      }
      return closing;
    });
    // The rows went in raw SQL, past the models' hooks: forget every cached membership.
    this.memberCache.clear();
    await this.sessions.destroyForUsers(closed);
    let files = 0;
    for (const file of snap.files.keys()) {
      try {
        await rm(file, { force: true });
        files++;
      } catch (err) {
        this.logger.error(
          `A deleted household's file could not be removed (${(err as Error).name})`,
        );
      }
    }
    for (const key of snap.objects.keys()) {
      try {
        await this.storage.remove(key);
        files++;
      } catch (err) {
        this.logger.error(
          `A deleted household's photo could not be removed (${(err as Error).name})`,
        );
      }
    }
    await rm(path.join(this.photosDir, String(member.householdId)), {
      recursive: true,
      force: true,
    });
    return {
      householdId: member.householdId,
      rows,
      files,
      accountsClosed: closed.length,
      yourAccountClosed: closed.includes(member.userId),
    };
  }
}

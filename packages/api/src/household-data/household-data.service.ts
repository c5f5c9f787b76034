import { existsSync } from 'node:fs';
import { readdir, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection } from '@nestjs/sequelize';
import { QueryTypes, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import yazl from 'yazl';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import type { AppConfig } from '../config/app.config.js';
import { HouseholdsService } from '../households/households.service.js';
import { SessionStoreService } from '../sessions/session-store.service.js';
import {
  deletionOrder,
  type HouseholdTable,
  householdTables,
  quoteIdentifier as q,
  type TableInfo,
} from './household-tables.js';

type Row = Record<string, unknown>;

/** Secrets never leave in an export, even hashed. */
const SECRET_COLUMNS = /(^|_)(password_hash|token_hash|secret)$/;
/** Columns that may name a stored file (a photo's storage key or path), relative to the photos folder. */
const FILE_COLUMNS = /(^|_)(key|path|file|filename)$/;

export interface HouseholdSnapshot {
  household: { id: number; name: string };
  tables: Map<string, Row[]>;
  /** Absolute path → path inside the archive. */
  files: Map<string, string>;
}

export interface DeletionSummary {
  householdId: number;
  rows: Record<string, number>;
  files: number;
  accountsClosed: number;
  /** Whether the account that asked was closed too (it had no other household). */
  yourAccountClosed: boolean;
}

@Injectable()
export class HouseholdDataService {
  private readonly logger = new Logger(HouseholdDataService.name);
  private readonly photosDir: string;
  private readonly adminEmails: readonly string[];

  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly households: HouseholdsService,
    private readonly sessions: SessionStoreService,
    config: ConfigService,
  ) {
    const app = config.getOrThrow<AppConfig>('app');
    this.photosDir = path.resolve(app.photosDir);
    this.adminEmails = app.adminEmails;
  }

  /** Every household row (secrets left out), the members' accounts, and the household's files. */
  async snapshot(member: MemberContext): Promise<HouseholdSnapshot> {
    const household = await this.households.findCurrent(member);
    return this.sequelize.transaction(async (transaction) => {
      const tables = new Map<string, Row[]>();
      for (const table of await this.householdTables(transaction)) {
        const rows = await this.select<Row>(
          `SELECT * FROM ${q(table.name)} WHERE ${table.where} ORDER BY rowid`,
          member.householdId,
          transaction,
        );
        tables.set(table.name, rows.map(withoutSecrets));
      }
      tables.set(
        'users',
        await this.select<Row>(
          'SELECT id, email, display_name, created_at FROM users WHERE id IN (SELECT user_id FROM memberships WHERE household_id = ?) ORDER BY id',
          member.householdId,
          transaction,
        ),
      );
      const files = await this.filesOf(member.householdId, tables);
      return { household: { id: household.id, name: household.name }, tables, files };
    });
  }

  /** A zip with `manifest.json`, `tables/<table>.json` and `photos/…`, ready to pipe. */
  async exportZip(member: MemberContext): Promise<yazl.ZipFile> {
    const snap = await this.snapshot(member);
    const zip = new yazl.ZipFile();
    const counts = Object.fromEntries([...snap.tables].map(([name, rows]) => [name, rows.length]));
    const manifest = {
      format: 'workback-household-export',
      formatVersion: 1,
      exportedAt: new Date().toISOString(),
      household: snap.household,
      tables: counts,
      files: snap.files.size,
      notes: [
        'One JSON file per table under tables/, with this household’s rows only; column names as stored.',
        'users.json lists the members’ accounts (no passwords). Password hashes and link tokens are left out.',
        'Photos, as stored (metadata already stripped), are under photos/.',
      ],
    };
    zip.addBuffer(Buffer.from(JSON.stringify(manifest, null, 2)), 'manifest.json');
    for (const [name, rows] of snap.tables) {
      zip.addBuffer(Buffer.from(JSON.stringify(rows, null, 2)), `tables/${name}.json`);
    }
    for (const [file, inside] of snap.files) zip.addFile(file, inside);
    zip.end();
    return zip;
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
    const snap = await this.snapshot(member);
    const rows: Record<string, number> = {};
    const closed = await this.sequelize.transaction(async (transaction) => {
      const memberIds = (
        await this.select<{ user_id: number }>(
          'SELECT user_id FROM memberships WHERE household_id = ?',
          member.householdId,
          transaction,
        )
      ).map((r) => r.user_id);
      for (const table of deletionOrder(await this.householdTables(transaction))) {
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

  private async householdTables(transaction: Transaction): Promise<HouseholdTable[]> {
    const names = await this.sequelize.query<{ name: string }>(
      "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name",
      { type: QueryTypes.SELECT, transaction },
    );
    const infos: TableInfo[] = [];
    for (const { name } of names) {
      const columns = await this.sequelize.query<{ name: string; notnull: number }>(
        `PRAGMA table_info(${q(name)})`,
        { type: QueryTypes.SELECT, transaction },
      );
      const keys = await this.sequelize.query<{ table: string; from: string; to: string }>(
        `PRAGMA foreign_key_list(${q(name)})`,
        { type: QueryTypes.SELECT, transaction },
      );
      const notNull = new Map(columns.map((c) => [c.name, c.notnull === 1]));
      infos.push({
        name,
        columns: columns.map((c) => c.name),
        foreignKeys: keys.map((k) => ({
          column: k.from,
          table: k.table,
          to: k.to ?? 'id',
          notNull: notNull.get(k.from) ?? false,
        })),
      });
    }
    return householdTables(infos);
  }

  private select<T extends object>(sql: string, householdId: number, transaction: Transaction) {
    return this.sequelize.query<T>(sql, {
      replacements: Array.from({ length: sql.split('?').length - 1 }, () => householdId),
      type: QueryTypes.SELECT,
      transaction,
    });
  }

  /** Files named by the household's rows, plus anything under photos/<householdId>/. */
  private async filesOf(householdId: number, tables: Map<string, Row[]>) {
    const files = new Map<string, string>();
    const add = async (candidate: string) => {
      const absolute = path.resolve(this.photosDir, candidate);
      const inside = path.relative(this.photosDir, absolute);
      if (!inside || inside.startsWith('..') || path.isAbsolute(inside)) return;
      if (files.has(absolute)) return;
      const info = await stat(absolute).catch(() => null);
      if (info?.isFile()) files.set(absolute, `photos/${inside.split(path.sep).join('/')}`);
    };
    for (const rows of tables.values()) {
      for (const row of rows) {
        for (const [column, value] of Object.entries(row)) {
          if (typeof value === 'string' && FILE_COLUMNS.test(column) && value.length < 512) {
            await add(value);
          }
        }
      }
    }
    const folder = path.join(this.photosDir, String(householdId));
    if (existsSync(folder)) {
      for (const entry of await readdir(folder, { recursive: true })) {
        await add(path.join(String(householdId), entry));
      }
    }
    return files;
  }
}

function withoutSecrets(row: Row): Row {
  return Object.fromEntries(Object.entries(row).filter(([column]) => !SECRET_COLUMNS.test(column)));
}

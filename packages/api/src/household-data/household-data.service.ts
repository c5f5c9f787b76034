import { existsSync } from 'node:fs';
import { readdir, stat } from 'node:fs/promises';
import path from 'node:path';
import { Inject, Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection } from '@nestjs/sequelize';
import { QueryTypes, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import yazl from 'yazl';
import { addToList } from '../common/add-to-list.js';
import type { MemberContext } from '../common/member-context.js';
import type { AppConfig } from '../config/app.config.js';
import { HouseholdsService } from '../households/households.service.js';
import { LocalPhotoStorage } from '../storage/local-photo-storage.js';
import {
  isPhotoKey,
  PHOTO_STORAGE,
  smallKeyOf,
  type PhotoStorage,
} from '../storage/photo-storage.js';
import {
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
  /** Photo storage key → path inside the archive, for storage that is not a local folder. */
  objects: Map<string, string>;
}

/** A household's data read out whole: the snapshot of its rows and files, and the export zip. */
@Injectable()
export class HouseholdDataService {
  private readonly logger = new Logger(HouseholdDataService.name);
  private readonly photosDir: string;

  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly households: HouseholdsService,
    @Inject(PHOTO_STORAGE) private readonly storage: PhotoStorage,
    config: ConfigService,
  ) {
    const app = config.getOrThrow<AppConfig>('app');
    this.photosDir = path.resolve(app.photosDir);
  }

  /** Every household row (secrets left out), the members' accounts, and the household's files. */
  async snapshot(member: MemberContext): Promise<HouseholdSnapshot> {
    const household = await this.households.findCurrent(member);
    return this.sequelize.transaction(async (transaction) => {
      const tables = new Map<string, Row[]>();
      for (const table of await this.householdTables(transaction)) {
        const rows = await this.select<Row>(
          `SELECT * FROM ${q(table.name)} WHERE ${table.where} ORDER BY ${this.rowOrder(table)}`,
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
      const local = this.storage instanceof LocalPhotoStorage;
      const files = local ? await this.filesOf(member.householdId, tables) : new Map();
      const objects = local ? new Map() : objectsOf(tables);
      return { household: { id: household.id, name: household.name }, tables, files, objects };
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
      files: snap.files.size + snap.objects.size,
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
    for (const [key, inside] of snap.objects) {
      // As with the local folder, a row whose file is gone is exported without it.
      const data = await this.storage.read(key).catch((err: NodeJS.ErrnoException) => {
        if (err.code === 'ENOENT') return undefined;
        throw err;
      });
      if (data) zip.addBuffer(data, inside);
    }
    zip.end();
    return zip;
  }

  /** SQLite keeps insertion order in rowid; PostgreSQL has none, so rows follow their key. */
  private rowOrder(table: HouseholdTable): string {
    if (this.sequelize.getDialect() === 'sqlite') return 'rowid';
    const keys = this.primaryKeys.get(table.name);
    return (keys?.length ? keys : table.columns.slice(0, 1)).map(q).join(', ');
  }

  private readonly primaryKeys = new Map<string, string[]>();

  /** The tables that hold household rows (foreign keys read from the database itself). */
  async householdTables(transaction: Transaction): Promise<HouseholdTable[]> {
    if (this.sequelize.getDialect() === 'postgres') return this.postgresTables(transaction);
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

  /** The same table facts as the SQLite pragmas give, from PostgreSQL's information schema. */
  private async postgresTables(transaction: Transaction): Promise<HouseholdTable[]> {
    const columns = await this.sequelize.query<{ table: string; column: string; notnull: boolean }>(
      `SELECT table_name AS "table", column_name AS "column", is_nullable = 'NO' AS notnull
         FROM information_schema.columns
        WHERE table_schema = current_schema()
          AND table_name IN (SELECT table_name FROM information_schema.tables
                              WHERE table_schema = current_schema() AND table_type = 'BASE TABLE')
        ORDER BY table_name, ordinal_position`,
      { type: QueryTypes.SELECT, transaction },
    );
    const constraints = await this.sequelize.query<{
      table: string;
      kind: string;
      column: string;
      ref_table: string | null;
      ref_column: string | null;
    }>(
      `SELECT k.table_name AS "table", c.constraint_type AS kind, k.column_name AS "column",
              r.table_name AS ref_table, r.column_name AS ref_column
         FROM information_schema.table_constraints c
         JOIN information_schema.key_column_usage k
           ON k.constraint_schema = c.constraint_schema AND k.constraint_name = c.constraint_name
         LEFT JOIN information_schema.referential_constraints rc
           ON rc.constraint_schema = c.constraint_schema AND rc.constraint_name = c.constraint_name
         LEFT JOIN information_schema.key_column_usage r
           ON r.constraint_schema = rc.unique_constraint_schema
          AND r.constraint_name = rc.unique_constraint_name
          AND r.ordinal_position = k.position_in_unique_constraint
        WHERE c.table_schema = current_schema()
          AND c.constraint_type IN ('PRIMARY KEY', 'FOREIGN KEY')
        ORDER BY k.table_name, k.ordinal_position`,
      { type: QueryTypes.SELECT, transaction },
    );
    const infos = new Map<string, TableInfo>();
    const notNull = new Map<string, boolean>();
    for (const c of columns) {
      const info = infos.get(c.table) ?? { name: c.table, columns: [], foreignKeys: [] };
      info.columns.push(c.column);
      infos.set(c.table, info);
      notNull.set(`${c.table}.${c.column}`, c.notnull);
    }
    this.primaryKeys.clear();
    for (const k of constraints) {
      if (k.kind === 'PRIMARY KEY') {
        addToList(this.primaryKeys, k.table, k.column);
      } else if (k.ref_table) {
        infos.get(k.table)?.foreignKeys.push({
          column: k.column,
          table: k.ref_table,
          to: k.ref_column ?? 'id',
          notNull: notNull.get(`${k.table}.${k.column}`) ?? false,
        });
      }
    }
    return householdTables([...infos.values()].sort((a, b) => (a.name < b.name ? -1 : 1)));
  }

  /** Rows of one query with the household id as its one replacement. */
  select<T extends object>(sql: string, householdId: number, transaction: Transaction) {
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
            // The list rows' small square has no column of its own (see smallKeyOf).
            if (column === 'storage_key') await add(smallKeyOf(value));
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

/** Photo keys named by the household's rows, each under photos/ in the archive. */
function objectsOf(tables: Map<string, Row[]>): Map<string, string> {
  const objects = new Map<string, string>();
  for (const rows of tables.values()) {
    for (const row of rows) {
      for (const [column, value] of Object.entries(row)) {
        if (typeof value === 'string' && FILE_COLUMNS.test(column) && isPhotoKey(value)) {
          objects.set(value, `photos/${value}`);
          if (column === 'storage_key') {
            objects.set(smallKeyOf(value), `photos/${smallKeyOf(value)}`);
          }
        }
      }
    }
  }
  return objects;
}

function withoutSecrets(row: Row): Row {
  return Object.fromEntries(Object.entries(row).filter(([column]) => !SECRET_COLUMNS.test(column)));
}

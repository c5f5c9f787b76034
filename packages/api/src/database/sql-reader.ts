import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Model, ModelStatic, Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type sqlite3 from 'sqlite3';

/** A value bound to a `?` of the SQL. */
export type SqlParam = string | number | boolean | null;

interface DriverConnection {
  /** pg's Client. */
  query?(sql: string, params: readonly SqlParam[]): Promise<{ rows: unknown[] }>;
}

interface ConnectionManager {
  getConnection(options: { type: 'SELECT' }): Promise<DriverConnection>;
  releaseConnection(connection: DriverConnection): void | Promise<void>;
}

/**
 * SELECTs for the reads nearly every request makes (open a miss, a notebook page's photos),
 * sent straight through the driver on the connections Sequelize keeps for reads. Each query
 * through a model also clones its options, builds its SQL, formats a stack trace and shapes
 * the rows: about half a millisecond of the event loop (0.8 ms against 0.27 ms for the same
 * SELECT, measured on this machine), which many families at once feel as queueing.
 *
 * SQL is written once for both databases: `?` parameters (numbered for PostgreSQL here) and
 * "double-quoted" names (back-quoted for SQLite here, which would otherwise take a misspelt
 * name in double quotes for a string and answer it on every row). Literals are in single
 * quotes and hold no `?` or `"`. Rows come as each driver gives them — SQLite's dates as text
 * and its booleans as 0/1, PostgreSQL's as Date and boolean — so callers convert as
 * `fromRawRow` does (driverDate, driverBoolean).
 */
@Injectable()
export class SqlReader {
  private readonly postgres: boolean;
  /** The SQL as this database is sent it, by the SQL as written. */
  private readonly dialectSql = new Map<string, string>();

  constructor(@InjectConnection() private readonly sequelize: Sequelize) {
    this.postgres = sequelize.getDialect() === 'postgres';
  }

  /**
   * The rows of a SELECT. Inside a `transaction` it runs on the transaction's own connection,
   * so it sees what the transaction wrote so far.
   */
  async rows<T>(
    sql: string,
    params: readonly SqlParam[] = [],
    transaction?: Transaction | null,
  ): Promise<T[]> {
    if (transaction) {
      // Sequelize keeps the driver's connection on the transaction once it has begun.
      const { connection } = transaction as unknown as { connection: DriverConnection };
      return this.query<T>(connection, sql, params);
    }
    const manager = this.sequelize.connectionManager as unknown as ConnectionManager;
    const connection = await manager.getConnection({ type: 'SELECT' });
    try {
      return await this.query<T>(connection, sql, params);
    } finally {
      await manager.releaseConnection(connection);
    }
  }

  /** On SQLite the connection keeps the statement compiled (database/sqlite-statements.ts). */
  private async query<T>(
    connection: DriverConnection,
    sql: string,
    params: readonly SqlParam[],
  ): Promise<T[]> {
    const text = this.forDialect(sql);
    if (this.postgres) return (await connection.query!(text, params)).rows as T[];
    return new Promise<T[]>((resolve, reject) =>
      (connection as sqlite3.Database).all(text, params, (err, rows) =>
        err ? reject(err) : resolve(rows as T[]),
      ),
    );
  }

  /** `?` as `$1`, `$2`, … for PostgreSQL; `"name"` as `` `name` `` for SQLite. */
  private forDialect(sql: string): string {
    let out = this.dialectSql.get(sql);
    if (out === undefined) {
      let n = 0;
      out = this.postgres ? sql.replace(/\?/g, () => `$${++n}`) : sql.replace(/"/g, '`');
      if (this.dialectSql.size < 1_000) this.dialectSql.set(sql, out);
    }
    return out;
  }
}

/** `?, ?, ?` for a list bound one value per `?`. */
export function placeholders(count: number): string {
  return Array.from({ length: count }, () => '?').join(', ');
}

/**
 * `"student_id" AS "studentId", …`: a model's attributes under their own names, as raw rows
 * have them. Returns a function, as a model knows its columns only once Sequelize has it.
 */
export function selectList<M extends Model>(
  model: ModelStatic<M>,
  attributes: readonly (keyof M['_attributes'] & string)[],
): () => string {
  let list: string | undefined;
  return () => {
    const all = model.getAttributes() as Record<string, { field?: string }>;
    list ??= attributes.map((a) => `"${all[a]?.field ?? a}" AS "${a}"`).join(', ');
    return list;
  };
}

/** A date as a driver gives it: PostgreSQL's Date, or SQLite's text ('2026-12-03 13:36:39.111 +00:00'). */
export function driverDate(v: unknown): Date {
  return v instanceof Date ? v : new Date(String(v).replace(' ', 'T').replace(' ', ''));
}

/** A boolean as a driver gives it: PostgreSQL's boolean, or SQLite's 0/1 (null stays null). */
export function driverBoolean(v: unknown): boolean | null {
  return v === null || v === undefined ? null : Boolean(v);
}

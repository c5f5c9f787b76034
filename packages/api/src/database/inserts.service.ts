import { Injectable, type OnModuleDestroy } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import {
  QueryTypes,
  type CreationAttributes,
  type Model,
  type ModelAttributeColumnOptions,
  type ModelStatic,
  type Transaction,
} from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { DatabaseService } from './database.service.js';
import { watchWrites } from './model-writes.js';
import { SqlReader } from './sql-reader.js';
import { exec, writeConnection, type RawConnection } from './sqlite-pragmas.js';

/** Rows of one model to insert, as `create` (one) or `bulkCreate` (several) would take them. */
export interface NewRows<M extends Model = Model> {
  model: ModelStatic<M>;
  values: readonly CreationAttributes<M>[];
}

/** A model's rows, built and checked as Sequelize's create would. */
interface BuiltRows {
  model: ModelStatic<Model>;
  rows: Model[];
}

type Hooked = ModelStatic<Model> & {
  runHooks(name: string, ...args: unknown[]): Promise<void>;
};

interface QueryGenerator {
  bulkInsertQuery(
    table: unknown,
    fieldValues: Record<string, unknown>[],
    options: object,
    attributesByField: Record<string, ModelAttributeColumnOptions>,
  ): string;
}

/** What `sequelize.dialect.Query` gives: Sequelize's own reading of a driver's error. */
type DialectQuery = new (
  connection: unknown,
  sequelize: Sequelize,
  options: object,
) => { formatError(err: Error): Error };

/**
 * A new row and the rows that hang off it (a miss with its rules, diagnosis and photos), in
 * one transaction.
 *
 * On SQLite the whole transaction goes to the write connection as one `exec`: BEGIN, the
 * INSERTs, COMMIT, run back to back on a worker thread. Sent through the models, each
 * statement waited for a turn of the event loop before the next was sent, all while holding
 * the write lock every family's writes queue for; under load those turns were most of a write's
 * time. The new row's id is therefore chosen here, one past the highest the table has used
 * (read once, then counted on, and read again after a row is made another way or an id turns
 * out taken). On PostgreSQL, where transactions run side by side, the id comes from the
 * table's sequence and the rows go through the models in an ordinary transaction.
 *
 * Either way the rows are built and validated by their models, stored exactly as `create`
 * stores them, and the models' write hooks run once they are committed, so the caches that
 * listen to them (pages, counts, members) hear of the rows as of any other write.
 */
@Injectable()
export class InsertsService implements OnModuleDestroy {
  /** The last id taken per table, while no row has been made there another way. */
  private readonly lastIds = new Map<string, number>();
  /** The unsubscribes of the models whose ids are counted on here. */
  private readonly watched = new Map<ModelStatic<Model>, () => void>();

  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly database: DatabaseService,
    private readonly reader: SqlReader,
  ) {}

  onModuleDestroy(): void {
    for (const unwatch of this.watched.values()) unwatch();
  }

  /**
   * Inserts a new row of `model` and its dependents: `rowsFor(id)` gives every row, the new
   * one first (with that id). Answers the id. A write refused by the database (a unique key
   * or a foreign key) fails as Sequelize's own error for it, with nothing written.
   */
  async withNewId<M extends Model>(
    model: ModelStatic<M>,
    rowsFor: (id: number) => readonly NewRows[],
  ): Promise<number> {
    if (this.sequelize.getDialect() !== 'sqlite') return this.inTransaction(model, rowsFor);
    this.watch(model);
    return this.database.writeQueue!.alone(async () => {
      const connection = await writeConnection(this.sequelize);
      // An id taken meanwhile by another process is refused by the primary key: once more,
      // from the table's own highest.
      for (let attempt = 1; ; attempt++) {
        const id = (this.lastIds.get(model.tableName) ?? (await this.highestId(model))) + 1;
        const groups = rowsFor(id).filter((group) => group.values.length > 0);
        const built = await Promise.all(groups.map((group) => build(group)));
        const sql = built.map((group) => this.insertSql(group)).join('\n');
        try {
          await exec(connection, `BEGIN IMMEDIATE TRANSACTION;\n${sql}\nCOMMIT;`);
        } catch (err) {
          // A failed statement leaves the transaction open; when BEGIN itself failed there is
          // none, and ROLLBACK's own complaint says nothing new.
          await exec(connection, 'ROLLBACK;').catch(() => undefined);
          this.lastIds.delete(model.tableName);
          if (attempt === 1 && idTaken(err, model.tableName)) continue;
          throw this.formatError(connection, err as Error);
        }
        for (const group of built) await afterInsert(group);
        this.lastIds.set(model.tableName, id);
        return id;
      }
    });
  }

  private async inTransaction<M extends Model>(
    model: ModelStatic<M>,
    rowsFor: (id: number) => readonly NewRows[],
  ): Promise<number> {
    // nextval is a bigint, which pg hands back as text.
    const [row] = await this.sequelize.query<{ id: string }>(
      'SELECT nextval(pg_get_serial_sequence(?, ?)) AS "id"',
      { replacements: [model.tableName, 'id'], type: QueryTypes.SELECT },
    );
    const id = Number(row!.id);
    await this.sequelize.transaction(async (transaction) => {
      // One after another: the dependents name the new row.
      for (const group of rowsFor(id)) await insertThroughModel(group, transaction);
    });
    return id;
  }

  /** Rows made through the model (not here) may have taken the next id: read it again then. */
  private watch(model: ModelStatic<Model>): void {
    if (this.watched.has(model)) return;
    this.watched.set(
      model,
      watchWrites([model], () => this.lastIds.delete(model.tableName)),
    );
  }

  /** Read while this process's writes wait in the queue, so none of them can move it. */
  private async highestId(model: ModelStatic<Model>): Promise<number> {
    const [row] = await this.reader.rows<{ id: number | null }>(
      `SELECT MAX(COALESCE((SELECT "seq" FROM "sqlite_sequence" WHERE "name" = ?), 0),
              COALESCE((SELECT MAX("id") FROM "${model.tableName}"), 0)) AS "id"`,
      [model.tableName],
    );
    return row?.id ?? 0;
  }

  private insertSql({ model, rows }: BuiltRows): string {
    const attributes = model.getAttributes() as Record<string, ModelAttributeColumnOptions>;
    const byField: Record<string, ModelAttributeColumnOptions> = {};
    for (const [name, attribute] of Object.entries(attributes)) {
      byField[attribute.field ?? name] = attribute;
    }
    const fieldValues = rows.map((row) => {
      const values: Record<string, unknown> = {};
      for (const [name, attribute] of Object.entries(attributes)) {
        const value: unknown = row.getDataValue(name as never);
        if (value !== undefined) values[attribute.field ?? name] = value;
      }
      return values;
    });
    return this.generator().bulkInsertQuery(model.getTableName(), fieldValues, {}, byField);
  }

  private generator(): QueryGenerator {
    return (this.sequelize.getQueryInterface() as unknown as { queryGenerator: QueryGenerator })
      .queryGenerator;
  }

  private formatError(connection: RawConnection, err: Error): Error {
    const Query = (this.sequelize as unknown as { dialect: { Query: DialectQuery } }).dialect.Query;
    return new Query(connection, this.sequelize, {}).formatError(err);
  }
}

/** Builds and validates rows as `create` does, with its timestamps. */
async function build({ model, values }: NewRows): Promise<BuiltRows> {
  const now = new Date();
  const attributes = model.getAttributes();
  const rows = values.map((v) => {
    const row = model.build(v as never);
    for (const stamp of ['createdAt', 'updatedAt']) {
      if (stamp in attributes && row.getDataValue(stamp as never) === undefined) {
        row.setDataValue(stamp as never, now as never);
      }
    }
    return row;
  });
  await Promise.all(rows.map((row) => row.validate()));
  return { model, rows };
}

/** The hooks `create` (one row) or `bulkCreate` (several) runs after writing. */
function afterInsert({ model, rows }: BuiltRows): Promise<void> {
  const hooked = model as Hooked;
  if (rows.length === 1) return hooked.runHooks('afterCreate', rows[0], {});
  return rows.length > 1 ? hooked.runHooks('afterBulkCreate', rows, {}) : Promise.resolve();
}

/** Rows through their model, in `transaction`: `create` for one, `bulkCreate` for several. */
export async function insertThroughModel(
  { model, values }: NewRows,
  transaction: Transaction,
): Promise<void> {
  if (values.length === 1) await model.create(values[0]!, { transaction });
  else if (values.length > 1) await model.bulkCreate(values, { transaction });
}

/** SQLite's refusal of an id already in `table`. */
function idTaken(err: unknown, table: string): boolean {
  return err instanceof Error && err.message.includes(`UNIQUE constraint failed: ${table}.id`);
}

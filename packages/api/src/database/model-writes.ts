import { randomUUID } from 'node:crypto';
import { Model, type ModelStatic, type Transaction } from 'sequelize';

/** Every hook Sequelize runs after a write through a model. */
export const WRITE_HOOKS = [
  'afterCreate',
  'afterUpdate',
  'afterDestroy',
  'afterBulkCreate',
  'afterBulkUpdate',
  'afterBulkDestroy',
  'afterUpsert',
] as const;

/** The transaction a write hook's arguments name, if any. */
export function transactionOf(args: readonly unknown[]): Transaction | undefined {
  const options = args.find(
    (a): a is { transaction?: Transaction | null } =>
      typeof a === 'object' && a !== null && !(a instanceof Model) && 'transaction' in a,
  );
  return options?.transaction ?? undefined;
}

/**
 * Calls `onWrite` after every write through these models with the rows written (none for a
 * bulk update or destroy, which name no rows), and again once the write's transaction commits:
 * a read between the write and the commit still sees the old rows. Returns the unsubscribe.
 */
export function watchWrites(
  models: readonly ModelStatic<Model>[],
  onWrite: (rows: readonly Model[]) => void,
): () => void {
  const name = `watch-writes-${randomUUID()}`;
  const hook = (...args: unknown[]) => {
    const first = args[0];
    const rows = (Array.isArray(first) ? first : [first]).filter(
      (row): row is Model => row instanceof Model,
    );
    onWrite(rows);
    transactionOf(args)?.afterCommit(() => onWrite(rows));
  };
  for (const model of models) for (const h of WRITE_HOOKS) model.addHook(h, name, hook);
  return () => {
    for (const model of models) for (const h of WRITE_HOOKS) model.removeHook(h, name);
  };
}

import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { describe, expect, it } from 'vitest';
import { allQueries } from './in-transaction.js';

const on = (dialect: string) => ({ getDialect: () => dialect }) as unknown as Sequelize;
const transaction = {} as Transaction;

/** Three queries that log when each starts and ends, each answered a moment after it starts. */
function queries(log: string[]) {
  const query = (name: string, value: number) => async () => {
    log.push(`start ${name}`);
    await new Promise((resolve) => setTimeout(resolve, 1));
    log.push(`end ${name}`);
    return value;
  };
  return [query('a', 1), query('b', 2), query('c', 3)] as const;
}

const together = ['start a', 'start b', 'start c'];
const inTurn = ['start a', 'end a', 'start b', 'end b', 'start c', 'end c'];

describe('allQueries', () => {
  it.each([
    ['a transaction’s queries on SQLite', 'sqlite', transaction],
    ['queries outside a transaction on PostgreSQL (a client each)', 'postgres', undefined],
  ])('sends %s side by side, answered in order', async (_, dialect, within) => {
    const log: string[] = [];
    expect(await allQueries(on(dialect), within, queries(log))).toEqual([1, 2, 3]);
    expect(log.slice(0, 3)).toEqual(together);
  });

  it('sends them one after another on PostgreSQL, where a transaction is one client', async () => {
    const log: string[] = [];
    expect(await allQueries(on('postgres'), transaction, queries(log))).toEqual([1, 2, 3]);
    expect(log).toEqual(inTurn);
  });

  it('on SQLite throws a failure only once every query sent beside it has finished', async () => {
    const log: string[] = [];
    const [, second] = queries(log);
    const failing = [() => Promise.reject(new Error('disk full')), second] as const;
    await expect(allQueries(on('sqlite'), transaction, failing)).rejects.toThrow('disk full');
    expect(log).toEqual(['start b', 'end b']);
  });

  it('passes on a failure', async () => {
    const failing = [async () => 1, () => Promise.reject(new Error('no such table'))] as const;
    await expect(allQueries(on('postgres'), transaction, failing)).rejects.toThrow('no such table');
    await expect(allQueries(on('sqlite'), transaction, failing)).rejects.toThrow('no such table');
  });
});

import pg from 'pg';
import { afterAll, expect } from 'vitest';

/**
 * A query sent on a pg client that is still answering another is queued by pg, deprecated, and
 * refused from pg 9. A transaction is one client, so its queries go in turn
 * (database/in-transaction.ts). pg itself warns only from the third query at once, and once a
 * process; this watches every query, so a second sent alongside the first fails its test file
 * too, naming where it was sent.
 */
type Client = pg.Client & { _activeQuery?: unknown; _queryQueue?: unknown[] };

const sentAlongside: string[] = [];
const query = pg.Client.prototype.query as (this: Client, ...args: unknown[]) => unknown;
pg.Client.prototype.query = function (this: Client, ...args: unknown[]) {
  // pg's own fields (pinned at 8.23): were they renamed, this watch would see nothing and pass.
  if (!Array.isArray(this._queryQueue)) {
    sentAlongside.push('pg.Client has no _queryQueue: this check no longer sees queued queries');
  } else if (this._activeQuery || this._queryQueue.length) {
    const stack = new Error().stack?.split('\n') ?? [];
    sentAlongside.push(
      stack
        .filter((line) => line.includes('/src/'))
        .slice(0, 3)
        .join(' <- '),
    );
  }
  return query.apply(this, args);
} as typeof pg.Client.prototype.query;

process.on('warning', (warning) => {
  if (warning.name === 'DeprecationWarning' && /client\.query\(\)/.test(warning.message)) {
    sentAlongside.push(warning.message);
  }
});

afterAll(() => {
  expect(sentAlongside, 'queries sent on a pg client while it answered another').toEqual([]);
});

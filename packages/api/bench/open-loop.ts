import { Pool } from 'undici';

export interface LoadRequest<K extends string> {
  kind: K;
  method: 'GET' | 'POST' | 'PUT';
  path: string;
  headers: Record<string, string>;
  body?: string | Buffer;
}

export interface KindStats {
  /** Milliseconds from each answered request's scheduled start to the end of its answer. */
  times: number[];
  /** Answers that were not 2xx, and requests that failed or were not answered in time. */
  failed: number;
  /** What each failure was: the answer's status, or the request's error code, counted. */
  why?: Map<string, number>;
}

/** Counts one failure of a kind under `why` (a status such as 500, or an error code). */
export function noteFailure(stats: KindStats, why: string): void {
  stats.failed++;
  stats.why ??= new Map();
  stats.why.set(why, (stats.why.get(why) ?? 0) + 1);
}

/** The failures of a run, worst first: `S 500 ×2, M ECONNRESET ×1`; empty without any. */
export function failureSummary<K extends string>(byKind: Map<K, KindStats>): string {
  return [...byKind]
    .flatMap(([kind, s]) => [...(s.why ?? [])].map(([why, n]) => ({ what: `${kind} ${why}`, n })))
    .sort((a, b) => b.n - a.n)
    .map(({ what, n }) => `${what} ×${n}`)
    .join(', ');
}

export interface OpenLoopResult<K extends string> {
  sent: number;
  answered: number;
  /** Requests still unanswered `graceMs` after the last was sent. */
  unanswered: number;
  byKind: Map<K, KindStats>;
  /** All answered times, sorted. */
  times: number[];
  errors: number;
}

/**
 * Open-loop load: requests start at Poisson arrival times of the offered `rate` (the seeded
 * `random` draws the gaps), whether or not earlier ones were answered, as many families acting
 * independently do. A request's time runs from when it was due, so a server (or a client) that
 * falls behind is charged for the wait, not only for the answer (no coordinated omission).
 *
 * autocannon's `overallRate` is not this: each connection sends its share back to back when a
 * one-second timer resets its count, and the timers of all connections fire together, so the
 * load arrives as one burst per second.
 */
export async function openLoop<K extends string>(options: {
  url: string;
  rate: number;
  seconds: number;
  random: () => number;
  next: () => LoadRequest<K>;
  kinds: readonly K[];
  /** How long unanswered requests are waited for once the last is sent. */
  graceMs?: number;
}): Promise<OpenLoopResult<K>> {
  const { rate, seconds, random, next } = options;
  const graceMs = options.graceMs ?? 10_000;
  // Enough sockets that the pool never holds a due request back while the server could take it.
  const pool = new Pool(options.url, { connections: 512, pipelining: 1 });
  const byKind = new Map<K, KindStats>(options.kinds.map((k) => [k, { times: [], failed: 0 }]));
  const pending = new Set<Promise<void>>();
  let sent = 0;
  let answered = 0;

  const send = (due: number) => {
    const request = next();
    const stats = byKind.get(request.kind)!;
    sent++;
    const done = pool
      .request({
        method: request.method,
        path: request.path,
        headers: request.headers,
        body: request.body,
        headersTimeout: graceMs,
        bodyTimeout: graceMs,
      })
      .then(async ({ statusCode, body }) => {
        await body.dump({ limit: Infinity });
        answered++;
        stats.times.push(performance.now() - due);
        if (statusCode < 200 || statusCode >= 300) noteFailure(stats, String(statusCode));
      })
      .catch((err: { code?: string }) => noteFailure(stats, err.code ?? 'no answer'))
      .finally(() => pending.delete(done));
    pending.add(done);
  };

  const start = performance.now();
  const end = start + seconds * 1000;
  let due = start;
  await new Promise<void>((resolve) => {
    const tick = () => {
      const now = performance.now();
      // Every request that has come due since the last wake-up starts now, timed from its due time.
      while (due <= now && due < end) {
        send(due);
        due += (-Math.log(1 - random()) / rate) * 1000;
      }
      if (due >= end) return resolve();
      setTimeout(tick, Math.max(0, due - performance.now()));
    };
    tick();
  });
  await Promise.race([
    Promise.allSettled([...pending]),
    new Promise((r) => setTimeout(r, graceMs).unref()),
  ]);
  const unanswered = pending.size;
  const times = [...byKind.values()].flatMap((k) => k.times).sort((a, b) => a - b);
  const errors = [...byKind.values()].reduce((n, k) => n + k.failed, 0) + unanswered;
  // Requests given up on fail as the pool closes; they are counted once, as unanswered.
  await pool.destroy();
  return { sent, answered, unanswered, byKind, times, errors };
}

import { readFileSync } from 'node:fs';

export function percentile(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const i = Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1);
  return sorted[Math.max(0, i)]!;
}

export function summary(samples: readonly number[]) {
  const sorted = [...samples].sort((a, b) => a - b);
  return { median: percentile(sorted, 50), p95: percentile(sorted, 95), n: sorted.length };
}

export const ms = (n: number) => `${n.toFixed(1)} ms`;

export function table(title: string, rows: Record<string, string | number>[]): void {
  console.log(`\n${title}`);
  console.table(rows);
}

/**
 * CPU time a process has used so far, in ms, from Linux's /proc: its main thread (the event
 * loop, where JavaScript runs) and all its threads (libuv's pool too). Undefined elsewhere.
 */
export function processCpuMs(pid: number): { main: number; all: number } | undefined {
  // Fields 14 and 15 of stat are user and system time in clock ticks (USER_HZ, 100 on Linux).
  const ticks = (file: string) => {
    const fields = readFileSync(file, 'utf8').split(') ')[1]!.split(' ');
    return (Number(fields[11]) + Number(fields[12])) * 10;
  };
  try {
    return { main: ticks(`/proc/${pid}/task/${pid}/stat`), all: ticks(`/proc/${pid}/stat`) };
  } catch {
    return undefined;
  }
}

/**
 * Waits until the process is quiet: all its threads together under a tenth of a core for half a
 * second, or `limitMs` at most. Between load runs, so that what one run leaves the server doing
 * is not charged to the next: autocannon stops at its duration with requests still unanswered,
 * and the server goes on working through them.
 */
export async function settle(pid: number, limitMs = 15_000): Promise<void> {
  const until = Date.now() + limitMs;
  while (Date.now() < until) {
    const before = processCpuMs(pid);
    await new Promise((r) => setTimeout(r, 500));
    const after = processCpuMs(pid);
    if (!before || !after || after.all - before.all <= 50) return;
  }
}

import { appendFileSync } from 'node:fs';

export interface Figure {
  area: string;
  measure: string;
  value: string;
  target?: string;
  met?: boolean;
}

/**
 * Hands figures to the one table the root `npm run bench` prints at the end: a JSON line
 * each, appended to the file named by BENCH_REPORT. Without it, nothing is written.
 */
export function report(figures: readonly Figure[]): void {
  const file = process.env.BENCH_REPORT;
  if (file) appendFileSync(file, figures.map((f) => `${JSON.stringify(f)}\n`).join(''));
}

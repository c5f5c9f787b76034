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

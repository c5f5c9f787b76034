import type { CheckedLine } from './checkLines.js';

/**
 * One number sentence's verdict in a parent's words, the same on screen, in print and in the
 * spreadsheet: `'Right'`, `'Differs: this comes to 42 · the first line that differs'`,
 * `'Right · follows from line 2'`.
 */
export function lineVerdict(
  line: Pick<CheckedLine, 'line' | 'ok' | 'expected' | 'followsFrom'>,
  firstWrongLine: number | null,
): string {
  return [
    line.ok ? 'Right' : `Differs: this comes to ${line.expected}`,
    ...(line.line === firstWrongLine ? ['the first line that differs'] : []),
    ...(line.followsFrom !== null ? [`follows from line ${line.followsFrom}`] : []),
  ].join(' · ');
}

import { diagnose } from '../diagnose/diagnose.js';
import type { Diagnosis } from '../diagnose/types.js';
import type { ReadError } from '../parse/types.js';

/** One number sentence the child wrote, checked on its own arithmetic. */
export interface CheckedLine {
  /** 1-based, as the parent reads the lines. */
  readonly line: number;
  readonly text: string;
  /** Whether the sentence's own arithmetic is right. */
  readonly ok: boolean;
  /** What its left side comes to. */
  readonly expected: string;
  /** What the child wrote after `=`. */
  readonly written: string;
  /** The engine's diagnosis of this sentence (rules, facts, first wrong step). */
  readonly diagnosis: Diagnosis;
  /**
   * The earlier wrong line (1-based) whose wrong result this line goes on with, when it does:
   * the line may be right in itself and still carry that error forward. `null` otherwise.
   */
  readonly followsFrom: number | null;
}

export type CheckedLines =
  | {
      readonly ok: true;
      readonly lines: readonly CheckedLine[];
      /** The first line whose own arithmetic is wrong (1-based), or `null` when all are right. */
      readonly firstWrongLine: number | null;
    }
  | {
      readonly ok: false;
      /** The line that could not be read (1-based) and why. */
      readonly line: number;
      readonly error: ReadError;
    };

/** Measurement words a child writes beside numbers; the arithmetic is checked without them. */
const UNITS =
  /(\d)\s*(mm|cm|km|m|g|kg|ml|l|in|ft|yd|mi|oz|lb|min|mins|h|hr|hrs|s|sec|secs|cents?|¢)\b\.?/gi;

const MAX_LINES = 20;

/**
 * Checks a word problem's number sentences one by one ("4 x 15 = 60", "60 - 18 = 48"): each
 * line's arithmetic, its own diagnosis, the first wrong line, and the later lines that go on
 * with a wrong result (right in themselves, but "following from" the earlier error). Whether the
 * sentences answer the question stays the parent's call. Units such as cm or kg are set aside.
 *
 * `checkLines(['4 x 15 = 60', '60 - 18 = 32', '32 + 7 = 39'])` →
 * `{ ok: true, firstWrongLine: 2, lines: [{ line: 1, ok: true, … }, { line: 2, ok: false,
 * expected: '42', … }, { line: 3, ok: true, followsFrom: 2, … }] }`.
 */
export function checkLines(lines: readonly string[]): CheckedLines {
  const written = lines.map((l) => l.trim()).filter((l) => l !== '');
  if (written.length === 0)
    return {
      ok: false,
      line: 1,
      error: { message: 'Write at least one number sentence, such as 4 × 15 = 60.' },
    };
  if (written.length > MAX_LINES)
    return {
      ok: false,
      line: MAX_LINES + 1,
      error: { message: `Check at most ${MAX_LINES} lines at a time.` },
    };
  const checked: CheckedLine[] = [];
  /** Wrong results written so far, as written → the line that wrote them. */
  const wrongResults = new Map<string, number>();
  for (const [index, text] of written.entries()) {
    const line = index + 1;
    const bare = text.replace(UNITS, '$1');
    const equals = bare.lastIndexOf('=');
    if (equals < 0)
      return {
        ok: false,
        line,
        error: {
          message: `Line ${line} has no “=”: write it as a number sentence, such as 60 − 18 = 42.`,
        },
      };
    const left = bare.slice(0, equals);
    const right = bare.slice(equals + 1);
    if (left.includes('='))
      return {
        ok: false,
        line,
        error: { message: `Line ${line} has more than one “=”; write one sentence per line.` },
      };
    const result = diagnose(left, right);
    if (!result.ok)
      return {
        ok: false,
        line,
        error: {
          message: `Line ${line}: ${result.part === 'answer' ? 'after “=”, ' : ''}${result.error.message}`,
        },
      };
    const operands = (left.replace(/,/g, '').match(/\d+(?:\.\d+)?/g) ?? []).map((n) =>
      n.replace(/^0+(?=\d)/, ''),
    );
    const from = operands.map((n) => wrongResults.get(n)).find((n) => n !== undefined) ?? null;
    checked.push({
      line,
      text,
      ok: result.correct,
      expected: result.expected,
      written: result.answer,
      diagnosis: result,
      followsFrom: from,
    });
    if (!result.correct) wrongResults.set(result.answer.replace(/,/g, ''), line);
  }
  const firstWrong = checked.find((l) => !l.ok);
  return { ok: true, lines: checked, firstWrongLine: firstWrong?.line ?? null };
}

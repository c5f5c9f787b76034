import { castOutElevens } from '../checks/castOutElevens.js';
import { castOutNines } from '../checks/castOutNines.js';
import type { CheckResult } from '../checks/types.js';
import { diagnose } from '../diagnose/diagnose.js';
import type { Diagnosis, WrittenSteps } from '../diagnose/types.js';
import { parseAnswer } from '../parse/parseAnswer.js';
import { parseProblem } from '../parse/parseProblem.js';
import { planCheckUp } from '../checkup/planCheckUp.js';
import { checkLines } from '../lines/checkLines.js';
import { practiceFor } from '../practice/practiceFor.js';
import { groupThousands } from '../numbers/groupThousands.js';
import { formatTrace } from './formatTrace.js';

/** Anything with a `write`, such as `process.stdout`. */
export interface Output {
  write(text: string): unknown;
}

const USAGE = `workback — Workback's step checker

Usage:
  workback diagnose "<problem>" "<answer>" [--steps JSON] [--json]
  workback nines "<problem>" "<answer>" [--json]
  workback practice <ruleId> [--count N] [--digits N] [--seed N] [--json]
  workback checkup <ruleId> [<ruleId> …] [--digits N] [--seed N] [--json]
  workback lines "<sentence>" ["<sentence>" …] [--json]
  workback --help

Examples:
  workback diagnose "304 - 75" "139"
  workback diagnose "34 x 12" "418" --steps '{"partials":["68","340"]}'
  workback nines "347 + 589" "936" --json
  workback practice sub.borrow-across-zero --count 5 --digits 4
  workback checkup sub.borrow-across-zero sub.borrow-from-zero --digits 4
  workback lines "4 x 15 = 60" "60 - 18 = 52" "52 + 7 = 59"

Exit status: 0 when a diagnosis (or check, practice set or check-up) was produced, 2 when the
problem, the answer or the command could not be read.
`;

interface Parsed {
  positional: string[];
  flags: Map<string, string | true>;
}

const VALUE_FLAGS = new Set(['--steps', '--count', '--digits', '--seed']);
const BOOLEAN_FLAGS = new Set(['--json', '--help', '-h']);

function readArgs(argv: readonly string[]): Parsed | string {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i += 1) {
    const arg = argv[i] as string;
    if (arg.startsWith('--') || arg === '-h') {
      const [name, inline] = arg.includes('=')
        ? [arg.slice(0, arg.indexOf('=')), arg.slice(arg.indexOf('=') + 1)]
        : [arg, undefined];
      if (VALUE_FLAGS.has(name)) {
        const value = inline ?? argv[i + 1];
        if (value === undefined) return `${name} needs a value.`;
        if (inline === undefined) i += 1;
        flags.set(name, value);
      } else if (BOOLEAN_FLAGS.has(name)) flags.set(name, true);
      else return `unknown option ${name}; see workback --help.`;
    } else positional.push(arg);
  }
  return { positional, flags };
}

/**
 * The `workback` command line. Returns the exit status: 0 when it produced a result, 2
 * with a one-line message on `err` when the input or the usage could not be read.
 * `main(['diagnose', '81 - 38', '57', '--json'], out, err)` → `0`, writing the Diagnosis JSON to `out`.
 */
export function main(argv: readonly string[], out: Output, err: Output): number {
  const fail = (message: string): number => {
    err.write(`workback: ${message}\n`);
    return 2;
  };
  const args = readArgs(argv);
  if (typeof args === 'string') return fail(args);
  const [command, ...rest] = args.positional;
  if (args.flags.has('--help') || args.flags.has('-h') || command === 'help') {
    out.write(USAGE);
    return 0;
  }
  if (command === undefined) return fail('no command given; try workback --help.');
  const json = args.flags.has('--json');

  if (command === 'diagnose') {
    if (rest.length !== 2)
      return fail(
        'diagnose needs a problem and an answer, e.g. workback diagnose "304 - 75" "139".',
      );
    let steps: WrittenSteps | undefined;
    const stepsText = args.flags.get('--steps');
    if (typeof stepsText === 'string') {
      try {
        steps = JSON.parse(stepsText) as WrittenSteps;
      } catch {
        return fail('the --steps value is not valid JSON, e.g. {"partials":["68","340"]}.');
      }
    }
    const result = diagnose(
      rest[0] as string,
      rest[1] as string,
      steps === undefined ? {} : { steps },
    );
    if (!result.ok) return fail(`could not read the ${result.part}: ${result.error.message}`);
    out.write(json ? `${JSON.stringify(result, null, 2)}\n` : describeDiagnosis(result));
    return 0;
  }

  if (command === 'nines') {
    if (rest.length !== 2)
      return fail('nines needs a problem and an answer, e.g. workback nines "347 + 589" "936".');
    const problem = parseProblem(rest[0] as string);
    if (!problem.ok) return fail(`could not read the problem: ${problem.error.message}`);
    const answer = parseAnswer(rest[1] as string);
    if (!answer.ok) return fail(`could not read the answer: ${answer.error.message}`);
    const nines = castOutNines(problem.problem, answer.answer);
    const elevens = castOutElevens(problem.problem, answer.answer);
    out.write(
      json
        ? `${JSON.stringify({ problem: problem.problem, answer: answer.answer.text, nines, elevens }, null, 2)}\n`
        : [
            `${problem.problem.text} = ${answer.answer.text}`,
            ...describeCheck('Casting out nines', nines),
            ...describeCheck('Elevens check', elevens),
            '',
          ].join('\n'),
    );
    return 0;
  }

  if (command === 'lines') {
    if (rest.length === 0)
      return fail(
        'lines needs the child’s number sentences, e.g. workback lines "4 x 15 = 60" "60 - 18 = 42".',
      );
    const checked = checkLines(rest);
    if (!checked.ok) return fail(checked.error.message);
    if (json) {
      out.write(`${JSON.stringify(checked, null, 2)}\n`);
      return 0;
    }
    const lines = checked.lines.map((l) => {
      const verdict = l.ok ? 'right' : `differs: it comes to ${groupThousands(l.expected)}`;
      const follows = l.followsFrom === null ? '' : ` (follows from line ${l.followsFrom})`;
      const rule = l.ok ? '' : (l.diagnosis.rules[0]?.explanation ?? '');
      return `${l.line}. ${l.text}    ${verdict}${follows}${rule ? `\n     ${rule}` : ''}`;
    });
    lines.push(
      checked.firstWrongLine === null
        ? 'Every sentence is worked right; whether they answer the question is your call.'
        : `The first sentence that differs is line ${checked.firstWrongLine}.`,
      '',
    );
    out.write(lines.join('\n'));
    return 0;
  }

  if (command === 'practice' || command === 'checkup') {
    const numbers = wholeNumberFlags(args.flags);
    if (typeof numbers === 'string') return fail(numbers);
    if (command === 'checkup') return checkUp(rest, numbers, json, out, fail);
    if (rest.length !== 1)
      return fail('practice needs one rule id, e.g. workback practice sub.borrow-across-zero.');
    const set = practiceFor(rest[0] as string, numbers);
    if (!set.ok) return fail(set.error.message);
    out.write(
      json
        ? `${JSON.stringify(set, null, 2)}\n`
        : [
            `Practice for ${set.ruleId}:`,
            ...set.problems.map(
              (p, i) =>
                `${i + 1}. ${p.problem}    (answer ${groupThousands(p.answer)}${p.ruleAnswer === null ? '' : `; the rule would give ${groupThousands(p.ruleAnswer)}`})`,
            ),
            '',
          ].join('\n'),
    );
    return 0;
  }
  return fail(`unknown command “${command}”; try workback --help.`);
}

/** `--count`, `--digits` and `--seed` as whole numbers, with their defaults; a message when one is not. */
function wholeNumberFlags(
  flags: Map<string, string | true>,
): { count: number; digits: number; seed: number } | string {
  const numbers = { count: 5, digits: 3, seed: 1 };
  for (const key of ['count', 'digits', 'seed'] as const) {
    const value = flags.get(`--${key}`);
    if (value === undefined) continue;
    if (typeof value !== 'string' || !/^\d{1,9}$/.test(value))
      return `--${key} needs a whole number.`;
    numbers[key] = Number(value);
  }
  return numbers;
}

function checkUp(
  ruleIds: readonly string[],
  numbers: { digits: number; seed: number },
  json: boolean,
  out: Output,
  fail: (message: string) => number,
): number {
  if (ruleIds.length === 0)
    return fail(
      'checkup needs one or more rule ids, e.g. workback checkup sub.borrow-across-zero sub.borrow-from-zero.',
    );
  const plan = planCheckUp(ruleIds, { digits: numbers.digits, seed: numbers.seed });
  if (!plan.ok) return fail(plan.error.message);
  if (json) {
    out.write(
      `${JSON.stringify({ problems: plan.problems, hypotheses: plan.hypotheses, merged: plan.merged }, null, 2)}\n`,
    );
    return 0;
  }
  const lines = [`Check-up for ${plan.hypotheses.slice(1).join(', ')} (and the usual working):`];
  plan.problems.forEach((p, i) => {
    lines.push(`${i + 1}. ${p.problem}`);
    for (const h of plan.hypotheses)
      lines.push(
        `     ${h === 'correct' ? 'usual working' : h}: ${groupThousands(p.answers[h] ?? '')}`,
      );
  });
  for (const m of plan.merged) lines.push(`Note: ${m.id} — ${m.reason}`);
  lines.push('', 'The answers are an aid to your judgement, not a grade.', '');
  out.write(lines.join('\n'));
  return 0;
}

function describeCheck(title: string, check: CheckResult): string[] {
  if (!check.applies) return [`${title}: does not apply — ${check.reason}`];
  return [
    `${title}:`,
    ...check.numbers.map(
      (n) =>
        `  ${n.number}: ${n.working.length > 0 ? `${n.working.join(', ')} → ` : ''}${n.residue}`,
    ),
    `  problem side ${check.problemSide.working}; answer side ${check.answerSide.working}`,
    `  ${check.verdict}`,
    ...check.warnings.map((w) => `  Note: ${w}`),
    `  ${check.caveat}`,
  ];
}

function describeDiagnosis(d: Diagnosis): string {
  const lines = [
    `Problem:  ${d.problem.text}`,
    `Answer:   ${d.answer}`,
    `Expected: ${groupThousands(d.expected)}`,
    d.correct ? 'The answer is right.' : 'The answer differs from the usual working.',
  ];
  if (d.writtenSteps !== null) {
    lines.push('Written steps, beside the usual working:');
    d.writtenSteps.steps.forEach((s, i) => {
      const work = s.work === '' ? '' : ` (${s.work})`;
      const mark = i === d.writtenSteps?.firstDiffers ? ' — the first that differs' : '';
      lines.push(
        s.ok
          ? `  ${s.label}${work}: ${s.written}, as in the usual working`
          : `  ${s.label}${work}: written ${s.written || 'nothing'}, usual ${s.expected || 'no such step'}${mark}`,
      );
      if (s.finding !== null) lines.push(`    ${s.finding.explanation}`);
    });
  }
  if (d.firstWrongStep !== null)
    lines.push(`First difference (${d.firstWrongStep.place}): ${d.firstWrongStep.note}`);
  if (!d.correct) {
    if (d.rules.length === 0)
      lines.push(
        'No rule in the catalog reproduces this answer; the comparison above is what can be said.',
      );
    else {
      lines.push('Ways of working that give exactly this answer (best first):');
      d.rules.forEach((r, i) => lines.push(`  ${i + 1}. ${r.id}: ${r.explanation}`));
    }
    for (const f of d.facts) {
      const sign = f.op === 'x' ? '×' : f.op === '-' ? '−' : f.op;
      // The first explanation usually says it already ("13 − 5 was taken as 9 instead of 8",
      // "5 + 6 + 1 carried was taken as 13 instead of 12"): not twice.
      if (d.rules[0]?.explanation.includes(`was taken as ${f.written} instead of ${f.expected}`))
        continue;
      lines.push(
        `Fact to look at: ${f.a} ${sign} ${f.b} = ${f.expected} (written ${f.written}, ${f.where})`,
      );
    }
  }
  for (const n of d.notes) lines.push(`Note: ${n}`);
  lines.push('', 'Usual working:', ...formatTrace(d.trace.expected).map((l) => `  ${l}`));
  if (d.trace.child !== null)
    lines.push(
      '',
      `The child's working as ${d.trace.child.ruleId} does it:`,
      ...formatTrace(d.trace.child.working).map((l) => `  ${l}`),
    );
  const { nines, elevens } = d.checks;
  lines.push(
    '',
    ...(!nines.applies && !elevens.applies && nines.reason === elevens.reason
      ? [`Casting out nines and the elevens check: do not apply — ${nines.reason}`]
      : [...describeCheck('Casting out nines', nines), ...describeCheck('Elevens check', elevens)]),
  );
  if (d.suggestedCause !== null)
    lines.push(
      '',
      `Suggested cause, for you to confirm: ${d.suggestedCause.cause}. ${d.suggestedCause.because}`,
    );
  lines.push('', 'These checks are an aid to your judgement, not a grade.', '');
  return withoutRepeats(lines).join('\n');
}

/**
 * Drops a sentence line that says again what an earlier line already says (a working's rule
 * line after the explanation that quotes it), so no line on the screen repeats another.
 * Drawing lines (digits, column labels, `= 2400`) are kept.
 */
function withoutRepeats(lines: readonly string[]): string[] {
  const out: string[] = [];
  for (const line of lines) {
    const text = line.trim();
    const sentence = /[a-z]{3}/i.test(text) && text.length >= 24 && text.endsWith('.');
    if (sentence && out.some((earlier) => earlier.includes(text))) continue;
    out.push(line);
  }
  return out;
}

// Hand-made misses for the pattern and plan tests, diagnosed by the engine itself.
import type { Cause } from '../domain/causes.js';
import { diagnose } from '../diagnose/diagnose.js';
import type { PlanMiss } from '../plans/types.js';

let nextId = 1;

/** A miss of `problem` answered `answer` on `occurredOn`, with its real diagnosis. */
export function missOf(
  occurredOn: string,
  problem: string,
  answer: string,
  extra: { id?: number; cause?: Cause; skills?: string[]; lessons?: number[] } = {},
): PlanMiss {
  const d = diagnose(problem, answer);
  if (!d.ok) throw new Error(`test miss ${problem} = ${answer}: ${d.error.message}`);
  return {
    id: extra.id ?? nextId++,
    occurredOn,
    cause: extra.cause ?? 'step',
    skills: extra.skills ?? [],
    problem: d.problem.text,
    answer,
    diagnosis: d,
    lessons: extra.lessons ?? [],
  };
}

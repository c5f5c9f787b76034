import { addColumns } from '../addition/addColumns.js';
import { ADDITION_RULES } from '../addition/diagnoseAddition.js';
import type { Problem } from '../parse/types.js';
import { SUBTRACTION_RULES } from '../subtraction/diagnoseSubtraction.js';
import { subtractColumns } from '../subtraction/subtractColumns.js';
import { pointRuleAnswers, scaledOf } from './diagnoseDecimal.js';
import { unscaleDecimal } from './decimalNumbers.js';

type DecimalProblem = Extract<Problem, { kind: 'decimal' }>;

/**
 * What a rule writes on a decimal problem: a column rule run on the lined-up columns, with the
 * point put back, or a point rule. Empty when the rule does not apply.
 * `decimalRuleAnswers('sub.borrow-no-decrement', parse('12.50 - 3.75'))` → `['19.85']`.
 */
export function decimalRuleAnswers(ruleId: string, problem: DecimalProblem): string[] {
  const point = pointRuleAnswers(problem)
    .filter((r) => r.id === ruleId)
    .map((r) => r.answer);
  if (point.length > 0) return point;
  const scaled = scaledOf(problem);
  let digits: string | null | undefined;
  if (problem.op === '+') {
    const rule = ADDITION_RULES.find((r) => r.id === ruleId);
    if (rule !== undefined) digits = addColumns([scaled.top, scaled.bottom], rule.method).result;
  } else if (problem.op === '−') {
    const rule = SUBTRACTION_RULES.find((r) => r.id === ruleId);
    if (rule !== undefined)
      digits = subtractColumns(scaled.top, scaled.bottom, rule.method)?.result;
  }
  return digits === null || digits === undefined
    ? []
    : [unscaleDecimal(digits, scaled.places, scaled.keep)];
}

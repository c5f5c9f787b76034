import { addColumns } from '../addition/addColumns.js';
import { ADDITION_RULES } from '../addition/diagnoseAddition.js';
import { divideDigitByDigit } from '../division/divideDigitByDigit.js';
import { divideLong } from '../division/divideLong.js';
import { addFractions } from '../fractions/addFractions.js';
import { compareFractions } from '../fractions/compareFractions.js';
import { compareAs } from '../decimals/diagnoseDecimalComparison.js';
import { decimalRuleAnswers } from '../decimals/decimalRuleAnswers.js';
import { workClock } from '../time/diagnoseClock.js';
import { solveMissing } from '../missing/solveMissing.js';
import { layoutOf, MULTIPLICATION_METHOD_RULES } from '../multiplication/diagnoseMultiplication.js';
import { multiplyLong } from '../multiplication/multiplyLong.js';
import { multiplyWithZerosSetAside } from '../multiplication/multiplyWithZerosSetAside.js';
import { trailingZeros } from '../numbers/digits.js';
import type { Problem } from '../parse/types.js';
import { ROUNDING_RULES } from '../rounding/diagnoseRounding.js';
import { roundToPlace } from '../rounding/roundToPlace.js';
import { SUBTRACTION_RULES } from '../subtraction/diagnoseSubtraction.js';
import { subtractColumns } from '../subtraction/subtractColumns.js';

/**
 * Runs one systematic rule's erroneous method on a problem and returns every answer it
 * can write (some rules have a choice, such as which factor's zeros to keep, or — for
 * `div.remainder-too-large` — how far short the last step stops). Empty when the rule does
 * not apply to this kind of problem, or is a fact rule or `mul.partials-added-wrong`
 * (those are not one fixed method).
 * `applyRule('sub.borrow-across-zero', parsed('304 - 75'))` → `['139']`.
 */
export function applyRule(ruleId: string, problem: Problem): string[] {
  const out: string[] = [];
  const push = (s: string | null | undefined): void => {
    if (s !== null && s !== undefined && !out.includes(s)) out.push(s);
  };
  switch (problem.kind) {
    case 'addition': {
      const rule = ADDITION_RULES.find((r) => r.id === ruleId);
      if (rule !== undefined) push(addColumns(problem.addends, rule.method).result);
      break;
    }
    case 'subtraction': {
      const rule = SUBTRACTION_RULES.find((r) => r.id === ruleId);
      if (rule !== undefined)
        push(subtractColumns(problem.minuend, problem.subtrahend, rule.method)?.result);
      break;
    }
    case 'multiplication': {
      const { top, bottom } = layoutOf(problem.factors);
      const rule = MULTIPLICATION_METHOD_RULES.find((r) => r.id === ruleId);
      if (rule !== undefined) push(multiplyLong(top, bottom, rule.method).result);
      const zt = trailingZeros(top);
      const zb = trailingZeros(bottom);
      if (ruleId === 'mul.zeros-dropped') {
        for (const n of [zt, zb])
          if (n !== zt + zb) push(multiplyWithZerosSetAside(top, bottom, n)?.result);
      }
      if (ruleId === 'mul.zeros-extra')
        push(multiplyWithZerosSetAside(top, bottom, zt + zb + 1)?.result);
      break;
    }
    case 'division': {
      const { dividend, divisor } = problem;
      if (ruleId === 'div.quotient-zero-omitted')
        push(divideLong(dividend, divisor, { zeroInQuotient: 'omit' })?.result);
      if (ruleId === 'div.remainder-too-large')
        for (let m = 1; m <= 9; m += 1)
          push(divideLong(dividend, divisor, { shortLast: m })?.result);
      if (ruleId === 'div.remainder-as-decimal') {
        const run = divideLong(dividend, divisor);
        if (run !== null && run.remainder !== '0') push(`${run.quotient}.${run.remainder}`);
      }
      if (ruleId === 'div.remainders-dropped') push(divideDigitByDigit(dividend, divisor)?.result);
      break;
    }
    case 'rounding': {
      const rule = ROUNDING_RULES.find((r) => r.id === ruleId);
      if (rule !== undefined)
        push(roundToPlace(problem.value, problem.place.exponent, rule.habit)?.result);
      break;
    }
    case 'missing':
      if (ruleId === 'missing.used-wrong-operation')
        push(solveMissing(problem, 'wrong-operation')?.result);
      if (ruleId === 'missing.copied-result')
        for (const n of [problem.a, problem.b, problem.result]) push(n);
      break;
    case 'fraction-sum':
      if (ruleId === 'frac.numerator-only') {
        for (const habit of ['numerator-only-left', 'numerator-only-right'] as const) {
          const t = addFractions(problem.left, problem.op, problem.right, habit);
          if (t !== null) push(`${t.unsimplified.numerator}/${t.unsimplified.denominator}`);
        }
      }
      if (ruleId === 'frac.add-across') {
        const t = addFractions(problem.left, problem.op, problem.right, 'across');
        if (t !== null) push(`${t.unsimplified.numerator}/${t.unsimplified.denominator}`);
      }
      break;
    case 'fraction-comparison':
      if (ruleId === 'frac.larger-denominator-larger')
        push(compareFractions(problem.left, problem.right, 'denominators')?.sign);
      break;
    case 'decimal':
      for (const answer of decimalRuleAnswers(ruleId, problem)) push(answer);
      break;
    case 'decimal-comparison':
      if (ruleId === 'dec.longer-is-larger' || ruleId === 'dec.shorter-is-larger')
        push(
          compareAs(
            problem.left,
            problem.right,
            ruleId === 'dec.longer-is-larger' ? 'longer-is-larger' : 'shorter-is-larger',
          ).sign,
        );
      break;
    case 'clock':
      if (ruleId === 'time.hundred-minutes') push(workClock(problem, 'hundred-minutes')?.result);
      if (ruleId === 'time.minutes-not-carried')
        push(workClock(problem, 'minutes-not-carried')?.result);
      break;
  }
  return out;
}

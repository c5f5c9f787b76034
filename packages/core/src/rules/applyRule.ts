import { ADDITION_RULES } from '../addition/diagnoseAddition.js';
import { addColumns } from '../addition/addColumns.js';
import type { Problem } from '../parse/types.js';
import { SUBTRACTION_RULES } from '../subtraction/diagnoseSubtraction.js';
import { subtractColumns } from '../subtraction/subtractColumns.js';

/**
 * Runs one systematic rule's erroneous method on a problem and returns every answer it
 * can write (some rules have a choice, such as which factor's zeros to keep). Empty when
 * the rule does not apply or is a fact rule (a fact slip is not one fixed method).
 * `applyRule('sub.borrow-across-zero', parsed('304 - 75'))` → `['139']`.
 */
export function applyRule(ruleId: string, problem: Problem): string[] {
  switch (problem.kind) {
    case 'addition': {
      const rule = ADDITION_RULES.find((r) => r.id === ruleId);
      return rule === undefined ? [] : [addColumns(problem.addends, rule.method).result];
    }
    case 'subtraction': {
      const rule = SUBTRACTION_RULES.find((r) => r.id === ruleId);
      const run =
        rule === undefined
          ? null
          : subtractColumns(problem.minuend, problem.subtrahend, rule.method);
      return run === null ? [] : [run.result];
    }
    default:
      return [];
  }
}

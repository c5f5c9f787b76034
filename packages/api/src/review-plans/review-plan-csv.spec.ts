import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { renderReviewPlanCsv } from './review-plan-csv.js';
import type { ReviewPlanJson } from './review-plans.service.js';

// Cells a spreadsheet would run as formulas: OWASP "CSV Injection" lists = + - @ tab and CR;
// the full-width forms (＝ ＋ － ＠) are normalised to them by some spreadsheets (csv-stringify's
// escape_formulas notes this of Apple Numbers).
const plan = (problem: string, answer: string, expected: string) =>
  ({
    items: [{ kind: 'miss', key: 'miss:7', title: '＠title', done: false, missIds: [7] }],
    misses: [{ id: 7, problem, answer, expected }],
    factFamilies: [],
    practice: [],
  }) as unknown as ReviewPlanJson;

describe('renderReviewPlanCsv', () => {
  it.each([
    ['＝HYPERLINK("x")', '＋1', '－1'],
    ['=1+1', '+1', '-1'],
    ['@SUM(1)', '\t2', '\r3'],
  ])('puts a quote before a cell that starts like a formula: %j', (problem, answer, expected) => {
    const rows = parse(renderReviewPlanCsv(plan(problem, answer, expected)), {
      relax_column_count: true,
    }) as string[][];
    expect(rows[1]).toEqual([
      're-work',
      "'＠title",
      `'${problem}`,
      `'${answer}`,
      `'${expected}`,
      '',
      'no',
      '7',
      '',
    ]);
  });

  it('leaves ordinary cells as they are', () => {
    const rows = parse(renderReviewPlanCsv(plan('12 − 5', '8', '7')), {}) as string[][];
    expect(rows[1]!.slice(2, 5)).toEqual(['12 − 5', '8', '7']);
  });
});

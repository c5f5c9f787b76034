import { INTERVIEW_STAGE_GUIDE } from '@workback/core';
import { stringify } from 'csv-stringify/sync';
import type { ReviewPlanJson } from './review-plans.service.js';

export const PLAN_CSV_COLUMNS = [
  'section',
  'item',
  'problem',
  'child_answer',
  'answer',
  'activity',
  'done',
  'miss_ids',
  'line_check',
] as const;

/**
 * The plan as rows for a spreadsheet: one per lesson range, fact family, miss, and practice
 * problem; a word problem's miss is followed by one `sentence` row per number sentence, its
 * verdict in `line_check` (the miss's own row names the interview stage there).
 */
export function renderReviewPlanCsv(plan: ReviewPlanJson): string {
  const rows: string[][] = [];
  for (const item of plan.items) {
    const done = item.done ? 'yes' : 'no';
    const misses = item.missIds.join(' ');
    if (item.kind === 'lesson') {
      rows.push(['lessons', item.title, '', '', '', '', done, misses, '']);
    } else if (item.kind === 'fact-family') {
      const f = plan.factFamilies.find((x) => `fact:${x.family}` === item.key);
      rows.push([
        'facts',
        item.title,
        f?.facts.join(', ') ?? '',
        '',
        '',
        f?.activity.title ?? '',
        done,
        misses,
        '',
      ]);
    } else if (item.kind === 'miss') {
      const m = plan.misses.find((x) => `miss:${x.id}` === item.key);
      if (m) {
        const stage = m.stage
          ? `went wrong at: ${INTERVIEW_STAGE_GUIDE[m.stage].stage.toLowerCase()}`
          : '';
        rows.push([
          're-work',
          item.title,
          m.problem,
          m.answer,
          m.expected ?? '',
          '',
          done,
          misses,
          stage,
        ]);
        for (const l of m.lines ?? [])
          rows.push([
            'sentence',
            `Line ${l.line} of ${m.problem}`,
            l.text,
            l.written,
            l.expected ?? '',
            '',
            done,
            misses,
            l.verdict ?? 'not checked',
          ]);
      }
    } else {
      const block = plan.practice.find((x) => `practice:${x.ruleId}` === item.key);
      for (const p of block?.problems ?? [])
        rows.push([
          'practice',
          `${p.number}. ${block!.title}`,
          p.problem,
          '',
          p.answer,
          '',
          done,
          misses,
          '',
        ]);
    }
  }
  // A spreadsheet reads a cell starting with = + - @ (or their full-width forms, tab or CR) as a
  // formula: csv-stringify gives such cells a leading quote, as the key CSV does.
  return stringify([[...PLAN_CSV_COLUMNS], ...rows], {
    record_delimiter: 'windows',
    escape_formulas: true,
  });
}

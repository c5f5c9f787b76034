import { CAUSE_GUIDE, INTERVIEW_STAGE_GUIDE } from '@workback/core';
import {
  checkbox,
  ensureRoom,
  finish,
  heading,
  INK,
  MARGIN,
  newDocument,
  PENCIL,
  printable,
  type Doc,
} from '../common/pdf/pdf-document.js';
import { CELL, drawWorking, workingWidth } from '../common/pdf/squared-paper.js';
import { writtenDate } from '../common/pdf/written-date.js';
import type { ReviewPlanJson } from './review-plans.service.js';

export const PLAN_FOOTER =
  'Workback aids a parent’s judgement: the checks show where working went differently; they do not grade the child.';

type PlanMissJson = ReviewPlanJson['misses'][number];

/** A problem as printed: `'304 - 75'` → `'304 − 75'`, `'7 x 8'` → `'7 × 8'`. */
export function printedProblem(problem: string): string {
  return printable(
    problem
      .replace(/(\d|\)|\?|_)\s*-\s*(?=[\d$?_(])/g, '$1 − ')
      .replace(/(\d|\?|_)\s*[x*]\s*(?=[\d?_])/gi, '$1 × ')
      .replace(/(\d)\s+\/\s+(?=\d)/g, '$1 ÷ '),
  );
}

/** `'Child wrote 139 · right answer 229'`: the label every figure of a miss carries. */
export function figureLabel(m: { answer: string; expected: string | null }): string {
  return `Child wrote ${m.answer} · right answer ${m.expected ?? 'not worked out by the checker'}`;
}

/**
 * The printable review list. Page 1 is a summary: the lessons, the facts and the 3–5
 * problems most worth re-working. Then the checklist in full: lessons, fact families with
 * activities, each missed problem with its working on squared paper (right working beside
 * the child's, the first differing column shaded), practice problems, and the answers on a
 * page of their own. Dates are written as people write them; numbers are "1. 4006 − 989".
 */
export async function renderReviewPlanPdf(plan: ReviewPlanJson): Promise<Buffer> {
  const doc = newDocument(
    `Review plan for ${plan.student.name}, ${writtenDate(plan.scheduledFor)}`,
  );
  const width = doc.page.width - 2 * MARGIN;
  const numberOf = new Map(plan.misses.map((m, i) => [m.id, i + 1]));
  const tick = (label: string, done: boolean, bold = false) => {
    ensureRoom(doc, 30);
    const y = doc.y;
    checkbox(doc, MARGIN, y);
    if (done)
      doc
        .font('sansBold')
        .fontSize(9)
        .text('x', MARGIN + 2, y + 0.5, { lineBreak: false });
    doc
      .font(bold ? 'sansBold' : 'sans')
      .fontSize(10.5)
      .fillColor(INK)
      .text(printable(label), MARGIN + 16, y, { width: width - 16 });
    doc.font('sans');
  };
  const small = (text: string, indent = 16, color = PENCIL) => {
    doc
      .font('sans')
      .fontSize(9.5)
      .fillColor(color)
      .text(printable(text), MARGIN + indent, doc.y, { width: width - indent });
    doc.fillColor(INK).fontSize(10.5);
  };
  const bullet = (text: string) => {
    ensureRoom(doc, 20);
    const y = doc.y;
    doc
      .font('sans')
      .fontSize(10.5)
      .fillColor(INK)
      .text('•', MARGIN + 2, y, { lineBreak: false });
    doc.text(printable(text), MARGIN + 16, y, { width: width - 16 });
  };

  // Page 1: the summary.
  doc.font('sansBold').fontSize(20).text(`Review plan for ${plan.student.name}`);
  doc
    .font('sans')
    .fontSize(11)
    .fillColor(PENCIL)
    .text(
      `Review day ${writtenDate(plan.scheduledFor)} · grade ${plan.student.gradeLevel} · ${count(plan.misses.length, 'missed problem')} · made ${writtenDate(plan.createdAt.toISOString())}`,
    )
    .fillColor(INK);
  if (plan.warning) {
    doc.moveDown(0.4).font('sansItalic').fontSize(10).text(plan.warning.message).font('sans');
  }
  doc.moveDown(0.5);
  small(
    'This page is the summary: start here. Every problem with its working follows from page 2, then fresh practice; the answers come last, from the page headed “Answers”.',
    0,
  );
  heading(doc, 'Lessons to revisit');
  if (plan.summary.lessons.length === 0) doc.text('No lessons named for these misses.');
  for (const l of plan.summary.lessons) bullet(l.replace(/^Revisit l/, 'L'));
  heading(doc, 'Facts to drill');
  if (plan.summary.facts.length === 0) doc.text('No basic facts were wrong in these misses.');
  for (const f of plan.summary.facts) bullet(f);
  heading(doc, 'Problems most worth re-working');
  if (plan.summary.focus.length === 0) doc.text('The misses of this plan have been deleted.');
  plan.summary.focus.forEach((f, i) => {
    ensureRoom(doc, 44);
    doc
      .font('sansBold')
      .fontSize(11)
      .text(`${i + 1}. ${printedProblem(f.problem)}`, MARGIN, doc.y, { width });
    small(
      `${figureLabel(f)} · ${writtenDate(f.occurredOn)} · problem ${numberOf.get(f.missId) ?? '?'} in the full list`,
    );
    small(f.reason);
    doc.moveDown(0.3);
  });
  if (plan.notes.length > 0) {
    doc.moveDown(0.5);
    for (const n of plan.notes) small(printedProblem(n), 0);
  }

  // The full plan.
  doc.addPage();
  doc.font('sansBold').fontSize(16).text('The whole plan');
  small('Tick each box when it is done.', 0);

  heading(doc, 'Lessons to revisit');
  if (plan.lessons.ranges.length === 0) doc.text('No lessons named for these misses.');
  for (const item of plan.items.filter((i) => i.kind === 'lesson')) tick(item.title, item.done);

  heading(doc, 'Fact families to drill');
  if (plan.factFamilies.length === 0) doc.text('No basic facts were wrong in these misses.');
  for (const item of plan.items.filter((i) => i.kind === 'fact-family')) {
    const f = plan.factFamilies.find((x) => `fact:${x.family}` === item.key);
    if (!f) continue;
    tick(`${f.label}: ${f.facts.join(', ')}`, item.done);
    doc
      .font('sansBold')
      .fontSize(10)
      .text(`${f.activity.title}. `, MARGIN + 16, doc.y, { continued: true, width: width - 16 })
      .font('sans')
      .text(printable(f.activity.how));
    if (f.alternatives?.length)
      small(`Other days: ${f.alternatives.map((a) => a.title.toLowerCase()).join(', ')}.`);
    doc.moveDown(0.4);
  }

  heading(doc, 'Problems to re-work together');
  if (plan.misses.length === 0) doc.text('The misses of this plan have been deleted.');
  for (const [i, m] of plan.misses.entries()) {
    drawMiss(doc, plan, m, i + 1, width, tick, small);
    // A long plan is laid out in turns: other requests' short steps (a transaction's next
    // statement, holding the write lock) are not kept waiting behind all of it.
    if (i % 4 === 3) await new Promise<void>((resolve) => setImmediate(resolve));
  }

  heading(doc, 'Practice problems');
  if (plan.practice.length === 0) doc.text('No written-method errors to practise this time.');
  for (const block of plan.practice) {
    const item = plan.items.find((i) => i.key === `practice:${block.ruleId}`);
    tick(`${block.title}: ${count(block.problems.length, 'fresh problem')}`, item?.done ?? false);
    doc.moveDown(0.3);
    block.problems.forEach((p, i) => {
      if (i % 2 === 0) ensureRoom(doc, 64);
      const x = MARGIN + 16 + (i % 2) * (width / 2);
      const y = doc.y;
      doc
        .font('sans')
        .fontSize(12)
        .fillColor(INK)
        .text(`${p.number}. ${printedProblem(p.problem)} =`, x, y, {
          width: width / 2 - 24,
          lineBreak: false,
        });
      doc.y = i % 2 === 1 || i === block.problems.length - 1 ? y + 60 : y;
    });
    doc.x = MARGIN;
    doc.font('sans').fontSize(10.5);
  }

  doc.addPage();
  doc.font('sansBold').fontSize(16).text('Answers');
  small('For the grown-up: keep the answers apart while the problems are worked.', 0);
  doc.moveDown(0.6);
  const answer = (text: string) => {
    ensureRoom(doc, 18);
    doc
      .font('sans')
      .fontSize(10.5)
      .fillColor(INK)
      .text(printable(text), MARGIN + 12, doc.y, { width: width - 12 });
    doc.y += 2;
  };
  for (const block of plan.practice) {
    doc.font('sansBold').fontSize(11).text(block.title, MARGIN);
    for (const p of block.problems)
      answer(`${p.number}. ${printedProblem(p.problem)} = ${p.answer}`);
    doc.moveDown(0.5);
  }
  if (plan.misses.length > 0) {
    doc.font('sansBold').fontSize(11).text('The missed problems', MARGIN);
    plan.misses.forEach((m, i) =>
      answer(
        `${i + 1}. ${printedProblem(m.problem)} = ${m.expected ?? '(not worked out by the checker)'}`,
      ),
    );
  }
  return finish(doc, PLAN_FOOTER);
}

/** One missed problem: its number and problem, the labels, the child's words, the two workings. */
function drawMiss(
  doc: Doc,
  plan: ReviewPlanJson,
  m: PlanMissJson,
  n: number,
  width: number,
  tick: (label: string, done: boolean, bold?: boolean) => void,
  small: (text: string, indent?: number, color?: string) => void,
) {
  const item = plan.items.find((i) => i.key === `miss:${m.id}`);
  const expected = m.trace?.expected ?? null;
  const child = m.trace?.child ?? null;
  const rows = Math.max(expected ? 6 : 1, child ? 6 : 1);
  ensureRoom(doc, 70 + rows * CELL + (m.lines?.length ?? 0) * 14);
  tick(`${n}. ${printedProblem(m.problem)}`, item?.done ?? false, true);
  small(
    `${figureLabel(m)} · ${writtenDate(m.occurredOn)} · cause noted: ${CAUSE_GUIDE[m.cause].label.toLowerCase()}`,
  );
  if (m.explanation)
    doc
      .font('sansItalic')
      .fontSize(10)
      .text(`In the child’s words: “${printable(m.explanation)}”`, MARGIN + 16, doc.y, {
        width: width - 16,
      })
      .font('sans');
  if (expected) {
    const top = doc.y + 4;
    const half = width / 2 - 16;
    const highlight = m.firstWrongStep?.place ?? null;
    doc.font('sans').fontSize(8.5).fillColor(PENCIL);
    doc.text(`The right working · answer ${m.expected ?? ''}`, MARGIN + 16, top, {
      width: half,
      lineBreak: false,
    });
    doc.text(
      child ? `How the child worked it · wrote ${m.answer}` : `The child wrote ${m.answer}`,
      MARGIN + 16 + width / 2,
      top,
      { width: half, lineBreak: false },
    );
    doc.fillColor(INK);
    const h1 = drawWorking(doc, expected, MARGIN + 16, top + 12, { width: half, highlight });
    let h2: number;
    if (child) {
      h2 = drawWorking(doc, child, MARGIN + 16 + width / 2, top + 12, {
        color: PENCIL,
        width: half,
        highlight,
      });
    } else {
      const cells = workingWidth(expected);
      doc
        .font('mono')
        .fontSize(11)
        .fillColor(PENCIL)
        .text(m.answer, MARGIN + 16 + width / 2 + (cells === null ? 0 : 4), top + 14, {
          lineBreak: false,
        });
      h2 = 16;
    }
    doc.x = MARGIN + 16;
    doc.y = top + 12 + Math.max(h1, h2) + 4;
  }
  const written = m.writtenSteps;
  if (written && written.steps.length > 0) {
    small(
      written.kind === 'partials'
        ? 'The partial products the child wrote, beside the usual ones:'
        : 'The division lines the child wrote, beside the usual ones:',
    );
    written.steps.forEach((s, i) => {
      const first = written.firstDiffers === i;
      small(
        `${s.label} (${s.work}): wrote ${s.written || 'nothing'} · usual ${s.expected || 'none'}${s.ok ? ' · same' : first ? ' · the first that differs' : ' · differs'}`,
        28,
        first ? INK : PENCIL,
      );
    });
  }
  if (m.lines) {
    small('The number sentences the child wrote, each line’s arithmetic checked:');
    for (const l of m.lines) {
      const first = l.line === m.firstWrongLine;
      doc
        .font(first ? 'monoBold' : 'mono')
        .fontSize(10)
        .fillColor(first ? INK : PENCIL)
        .text(`${l.line}. ${printedProblem(l.text)}`, MARGIN + 28, doc.y, {
          width: width - 28,
          continued: l.verdict !== null,
        });
      if (l.verdict !== null) doc.font('sans').fontSize(9.5).text(`   ${l.verdict}`);
    }
    doc.fillColor(INK);
  }
  if (m.stage) {
    const s = INTERVIEW_STAGE_GUIDE[m.stage];
    small(`Where it went wrong: “${s.prompt}” (${s.stage.toLowerCase()}).`, 16, INK);
  } else if (m.lines) {
    small('Whether the sentences answer the question is for you and the child to talk over.');
  }
  const why = m.firstWrongStep?.note ?? m.ruleExplanation;
  if (why) small(child && m.ruleName ? `${m.ruleName}. ${why}` : why, 16, INK);
  doc.fontSize(10.5).moveDown(0.8);
}

function count(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

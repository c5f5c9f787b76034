import { CAUSE_GUIDE } from '@workback/core';
import {
  checkbox,
  ensureRoom,
  finish,
  heading,
  INK,
  MARGIN,
  monoText,
  newDocument,
  PENCIL,
  printable,
  working,
} from '../common/pdf/pdf-document.js';
import type { ReviewPlanJson } from './review-plans.service.js';

export const PLAN_FOOTER =
  'Workback aids a parent’s judgement: the checks show where working went differently; they do not grade the child.';

/**
 * The printable review list: header, lessons to revisit, fact families with an activity,
 * each missed problem with its working drawn in monospace columns, practice problems,
 * and the answers on a page of their own.
 */
export async function renderReviewPlanPdf(plan: ReviewPlanJson): Promise<Buffer> {
  const doc = newDocument(`Review plan for ${plan.student.name}, ${plan.scheduledFor}`);
  const width = doc.page.width - 2 * MARGIN;
  const tick = (label: string, done: boolean) => {
    ensureRoom(doc, 30);
    const y = doc.y;
    checkbox(doc, MARGIN, y);
    if (done)
      doc
        .font('sansBold')
        .fontSize(9)
        .text('x', MARGIN + 2, y + 0.5, { lineBreak: false });
    doc
      .font('sans')
      .fontSize(10.5)
      .fillColor(INK)
      .text(printable(label), MARGIN + 16, y, { width: width - 16 });
  };

  doc.font('sansBold').fontSize(20).text(`Review plan for ${plan.student.name}`);
  doc
    .font('sans')
    .fontSize(11)
    .fillColor(PENCIL)
    .text(
      `Review day ${plan.scheduledFor} · grade ${plan.student.gradeLevel} · ${plan.misses.length} missed problems · made ${plan.createdAt.toISOString().slice(0, 10)}`,
    )
    .fillColor(INK);
  if (plan.warning) {
    doc.moveDown(0.4).font('sansItalic').fontSize(10).text(plan.warning.message).font('sans');
  }

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
      .text(printable(f.activity.how))
      .moveDown(0.4);
  }

  heading(doc, 'Problems to re-work together');
  if (plan.misses.length === 0) doc.text('The misses of this plan have been deleted.');
  for (const m of plan.misses) {
    const item = plan.items.find((i) => i.key === `miss:${m.id}`);
    const expected = m.working?.expected ?? [];
    const child = m.working?.child ?? null;
    ensureRoom(doc, 80 + 15 * Math.max(expected.length, child?.length ?? 1));
    tick(
      `${m.problem}   written: ${m.answer}${m.expected ? `   (${m.expected})` : ''}   · ${m.occurredOn} · ${CAUSE_GUIDE[m.cause].label}`,
      item?.done ?? false,
    );
    if (m.explanation)
      doc
        .font('sansItalic')
        .fontSize(10)
        .text(`In the child’s words: “${printable(m.explanation)}”`, MARGIN + 16, doc.y, {
          width: width - 16,
        })
        .font('sans');
    if (expected.length > 0) {
      const top = doc.y + 6;
      doc.fontSize(8.5).fillColor(PENCIL);
      doc.text('The usual working', MARGIN + 16, top, { lineBreak: false });
      if (child)
        doc.text('The child’s working', MARGIN + 16 + width / 2, top, { lineBreak: false });
      doc.fillColor(INK).fontSize(10.5);
      const resultLine = expected.findIndex((l) => /^─+$/.test(l)) + 1;
      const h1 = working(doc, expected, MARGIN + 16, top + 12, { width: width / 2 - 24 });
      const h2 = child
        ? working(doc, child, MARGIN + 16 + width / 2, top + 12, {
            color: PENCIL,
            width: width / 2 - 24,
            highlightLine: resultLine > 0 ? resultLine : null,
          })
        : 0;
      doc.x = MARGIN + 16;
      doc.y = top + 12 + Math.max(h1, h2) + 4;
    }
    const why = m.firstWrongStep?.note ?? m.ruleExplanation;
    if (why) doc.fontSize(10).text(printable(why), MARGIN + 16, doc.y, { width: width - 16 });
    doc.fontSize(10.5).moveDown(0.8);
  }

  heading(doc, 'Practice problems');
  if (plan.practice.length === 0) doc.text('No written-method errors to practise this time.');
  for (const block of plan.practice) {
    const item = plan.items.find((i) => i.key === `practice:${block.ruleId}`);
    tick(`${block.title}: ${block.problems.length} fresh problems`, item?.done ?? false);
    doc.moveDown(0.3);
    // Two problems a row when they fit half the width (12 pt mono: 7.2 pt a character).
    const perRow = block.problems.every((p) => (p.problem.length + 7) * 7.2 < width / 2 - 16)
      ? 2
      : 1;
    block.problems.forEach((p, i) => {
      if (i % perRow === 0) ensureRoom(doc, 70);
      const x = MARGIN + 16 + (i % perRow) * (width / 2);
      const y = doc.y;
      monoText(doc, `${p.number}.  ${p.problem} =`, x, y, { size: 12 });
      if (i % perRow === perRow - 1 || i === block.problems.length - 1) doc.y = y + 60;
      else doc.y = y;
    });
    doc.x = MARGIN;
    doc.font('sans').fontSize(10.5);
  }

  const answerLine = (line: string) => {
    ensureRoom(doc, 18);
    const y = doc.y;
    if (line.length * 6.6 > width - 12) {
      doc
        .font('sans')
        .fontSize(10.5)
        .text(printable(line), MARGIN + 12, y, { width: width - 12 });
      doc.y += 3;
    } else {
      monoText(doc, line, MARGIN + 12, y, { size: 11 });
      doc.y = y + 16;
    }
    doc.x = MARGIN;
  };
  doc.addPage();
  doc.font('sansBold').fontSize(16).text('Answers');
  doc.font('sans').fontSize(10).fillColor(PENCIL).text('For the grown-up: keep this page apart.');
  doc.fillColor(INK).moveDown(0.6);
  for (const block of plan.practice) {
    doc.font('sansBold').fontSize(11).text(block.title);
    for (const p of block.problems) answerLine(`${p.number}.  ${p.problem} = ${p.answer}`);
    doc.moveDown(0.5);
  }
  if (plan.misses.length > 0) {
    doc.font('sansBold').fontSize(11).text('The missed problems');
    for (const m of plan.misses) answerLine(`${m.problem} = ${m.expected ?? '(not checked)'}`);
  }
  return finish(doc, PLAN_FOOTER);
}

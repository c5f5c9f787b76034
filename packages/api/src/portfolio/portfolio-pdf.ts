import {
  CAUSE_GUIDE,
  MISS_STATUS_LABEL,
  ruleInfo,
  type Cause,
  type MissStatus,
} from '@workback/core';
import {
  ensureRoom,
  finish,
  heading,
  INK,
  MARGIN,
  newDocument,
  PENCIL,
  printable,
  working,
} from '../common/pdf/pdf-document.js';

export const PORTFOLIO_NOTICE =
  'Kept by the family for its own records. It makes no claim about any jurisdiction’s requirements for home education.';

export interface PortfolioSample {
  occurredOn: string;
  problem: string;
  answer: string;
  expected: string | null;
  explanation: string;
  cause: Cause;
  status: MissStatus;
  ruleIds: string[];
  note: string | null;
  working: { expected: string[]; child: string[] | null } | null;
  photos: Buffer[];
}

/** Dated work samples with photos, diagnoses and the child's own explanations. */
export async function renderPortfolioPdf(input: {
  student: { name: string; gradeLevel: string };
  from: string | null;
  to: string | null;
  samples: readonly PortfolioSample[];
}): Promise<Buffer> {
  const doc = newDocument(`Work samples of ${input.student.name}`);
  const width = doc.page.width - 2 * MARGIN;
  doc.font('sansBold').fontSize(20).text(`Work samples of ${input.student.name}`);
  const span =
    input.from || input.to ? `${input.from ?? 'the start'} to ${input.to ?? 'today'}` : 'all dates';
  doc
    .font('sans')
    .fontSize(11)
    .fillColor(PENCIL)
    .text(`Grade ${input.student.gradeLevel} · ${span} · ${input.samples.length} samples`)
    .moveDown(0.3)
    .fontSize(10)
    .text(PORTFOLIO_NOTICE)
    .fillColor(INK);
  if (input.samples.length === 0) {
    heading(doc, 'No work samples in these dates');
    doc.text('Log missed problems with their photos and they will be listed here by date.');
  }
  for (const s of input.samples) {
    heading(doc, `${s.occurredOn}: ${s.problem}`);
    doc.text(
      `Written: ${s.answer}${s.expected ? ` · expected ${s.expected}` : ''} · cause: ${CAUSE_GUIDE[s.cause].label} · ${MISS_STATUS_LABEL[s.status]}`,
    );
    if (s.explanation)
      doc
        .font('sansItalic')
        .text(`In the child’s words: “${printable(s.explanation)}”`)
        .font('sans');
    const rules = s.ruleIds.map((id) => ruleInfo(id)?.title ?? id);
    if (rules.length) doc.text(`The step checkers matched: ${rules.join('; ')}.`);
    if (s.note) doc.fillColor(PENCIL).text(printable(s.note)).fillColor(INK);
    if (s.working) {
      ensureRoom(doc, 20 + 15 * s.working.expected.length);
      const top = doc.y + 4;
      const h1 = working(doc, s.working.expected, MARGIN, top, { width: width / 2 - 12 });
      const h2 = s.working.child
        ? working(doc, s.working.child, MARGIN + width / 2, top, {
            color: PENCIL,
            width: width / 2 - 12,
          })
        : 0;
      doc.x = MARGIN;
      doc.y = top + Math.max(h1, h2) + 6;
    }
    for (const photo of s.photos) {
      ensureRoom(doc, 250);
      doc.image(photo, MARGIN, doc.y, { fit: [width, 240] });
      doc.y += 246;
      doc.x = MARGIN;
    }
  }
  return finish(
    doc,
    'Workback aids a parent’s judgement; it does not grade or assess the child. ' +
      PORTFOLIO_NOTICE,
  );
}

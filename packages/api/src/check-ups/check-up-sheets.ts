import type { StoredSheet } from './models/check-up.model.js';
import { answerMeaning } from './check-up-words.js';
import { addToList } from '../common/add-to-list.js';
import {
  ensureRoom,
  finish,
  heading,
  MARGIN,
  monoText,
  newDocument,
  PENCIL,
  printable,
  RULE,
} from '../common/pdf/pdf-document.js';

interface SheetHeader {
  readonly studentName: string;
  readonly createdOn: string;
}

/** A date as people write it: `4 December 2026`. */
function longDate(iso: string): string {
  return new Date(`${iso.slice(0, 10)}T12:00:00Z`).toLocaleDateString('en-GB', {
    day: 'numeric',
    month: 'long',
    year: 'numeric',
    timeZone: 'UTC',
  });
}

/** The child's page: the problems, numbered, with room to work; no answers anywhere. */
export async function childSheetPdf(sheet: StoredSheet, header: SheetHeader): Promise<Buffer> {
  const doc = newDocument(`Check-up for ${header.studentName}`);
  doc
    .font('sansBold')
    .fontSize(18)
    .text(printable(`Check-up for ${header.studentName}`));
  doc.font('sans').fontSize(10.5).fillColor(PENCIL);
  doc.text('Date: ____________________     Work each problem in the space beside it.');
  doc.fillColor('#1f2a44').moveDown(1.5);
  const width = doc.page.width - 2 * MARGIN;
  const box = Math.min(110, (doc.page.height - doc.y - MARGIN - 40) / sheet.problems.length);
  sheet.problems.forEach((p, i) => {
    ensureRoom(doc, box);
    const y = doc.y;
    monoText(doc, `${i + 1}.  ${p.problem}  =`, MARGIN, y + 8, { size: 15 });
    doc
      .save()
      .lineWidth(0.6)
      .strokeColor(RULE)
      .moveTo(MARGIN, y + box - 6)
      .lineTo(MARGIN + width, y + box - 6)
      .stroke()
      .restore();
    doc.y = y + box;
  });
  return finish(doc, `Workback check-up made ${longDate(header.createdOn)}.`);
}

/** The parent's page: each problem with the answer every explanation would write, and what it means. */
export async function parentSheetPdf(sheet: StoredSheet, header: SheetHeader): Promise<Buffer> {
  const doc = newDocument(`Check-up for ${header.studentName}: answers`);
  doc
    .font('sansBold')
    .fontSize(16)
    .text(printable(`Check-up for ${header.studentName}: what each answer would mean`));
  doc.font('sans').fontSize(10.5).fillColor(PENCIL);
  doc.text(
    'Keep this page away from the child. Compare each answer the child writes with the lines below: an answer that matches a line speaks for that way of working. One answer off on its own is most likely a slip.',
    { width: doc.page.width - 2 * MARGIN },
  );
  doc.fillColor('#1f2a44');
  sheet.problems.forEach((p, i) => {
    heading(doc, `${i + 1}. ${p.problem}`);
    const byAnswer = new Map<string, string[]>();
    for (const h of sheet.hypotheses) {
      const answer = p.answers[h] as string;
      addToList(byAnswer, answer, answerMeaning(h));
    }
    for (const [answer, meanings] of byAnswer) {
      ensureRoom(doc, 18);
      const y = doc.y;
      monoText(doc, answer, MARGIN + 12, y, { size: 11 });
      doc.text(printable(`· ${meanings.join('; or ')}`), MARGIN + 110, y, {
        width: doc.page.width - 2 * MARGIN - 110,
      });
      doc.moveDown(0.2);
    }
  });
  for (const m of sheet.merged) {
    doc
      .moveDown(0.6)
      .fillColor(PENCIL)
      .text(printable(`Note: ${m.reason}`))
      .fillColor('#1f2a44');
  }
  return finish(
    doc,
    `Workback check-up made ${longDate(header.createdOn)}. The answers are an aid to your judgement, not a grade.`,
  );
}

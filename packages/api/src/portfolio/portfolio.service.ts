import { Injectable } from '@nestjs/common';
import { formatTrace } from '@workback/core';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { StudentMissesService } from '../misses/student-misses.service.js';
import { PhotoFilesService } from '../photos/photo-files.service.js';
import { PhotosService } from '../photos/photos.service.js';
import { StudentsService } from '../students/students.service.js';
import type { PortfolioQuery } from './dto/portfolio.query.js';
import { renderPortfolioPdf } from './portfolio-pdf.js';

/** At most this many samples in one portfolio: a longer span is split by dates. */
export const MAX_PORTFOLIO_SAMPLES = 200;

@Injectable()
export class PortfolioService {
  constructor(
    private readonly students: StudentsService,
    private readonly misses: StudentMissesService,
    private readonly photos: PhotosService,
    private readonly photoFiles: PhotoFilesService,
  ) {}

  async pdf(member: MemberContext, studentId: number, query: PortfolioQuery) {
    if (query.from && query.to && query.from > query.to)
      throw fieldsError({ to: 'to must be on or after from' });
    const student = await this.students.find(member, studentId);
    const misses = await this.misses.withDiagnoses(member, {
      studentId: student.id,
      from: query.from,
      to: query.to,
    });
    if (misses.length > MAX_PORTFOLIO_SAMPLES)
      throw fieldsError({
        from: `these dates hold ${misses.length} samples; choose from and to so at most ${MAX_PORTFOLIO_SAMPLES} fall between`,
      });
    const photos = await this.photos.forMisses(misses.map((m) => m.id));
    const samples = [];
    for (const m of misses) {
      const files = [];
      for (const p of photos.get(m.id) ?? [])
        files.push((await this.photoFiles.file(member, p.id, 'image')).data);
      const d = m.diagnosis;
      samples.push({
        occurredOn: m.occurredOn,
        problem: m.problem,
        answer: m.answer,
        expected: m.expected,
        explanation: m.explanation,
        cause: m.cause,
        status: m.status,
        ruleIds: m.ruleIds,
        note: m.note || null,
        working: d
          ? {
              expected: formatTrace(d.trace.expected),
              child: d.trace.child ? formatTrace(d.trace.child.working) : null,
            }
          : null,
        photos: files,
      });
    }
    const body = await renderPortfolioPdf({
      student: { name: student.name, gradeLevel: student.gradeLevel },
      from: query.from ?? null,
      to: query.to ?? null,
      samples,
    });
    const span = `${query.from ?? 'start'}-to-${query.to ?? 'now'}`;
    return { filename: `work-samples-${student.id}-${span}.pdf`, body };
  }
}

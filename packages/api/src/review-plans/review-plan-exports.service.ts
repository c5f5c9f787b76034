import { Injectable } from '@nestjs/common';
import { Role } from '@workback/core';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { HouseholdsService } from '../households/households.service.js';
import { MembersService } from '../households/members.service.js';
import { MailService } from '../mail/mail.service.js';
import { writtenDate } from '../common/pdf/written-date.js';
import { UsersService } from '../users/users.service.js';
import type { SendReviewPlanDto } from './dto/send-review-plan.dto.js';
import { renderReviewPlanCsv } from './review-plan-csv.js';
import { PlanPdfCache } from './plan-pdf-cache.js';
import { ReviewPlansService } from './review-plans.service.js';

/** A plan printed (PDF), as a spreadsheet (CSV), or e-mailed to chosen household members. */
@Injectable()
export class ReviewPlanExportsService {
  constructor(
    private readonly plans: ReviewPlansService,
    private readonly members: MembersService,
    private readonly households: HouseholdsService,
    private readonly users: UsersService,
    private readonly mail: MailService,
    private readonly pdfs: PlanPdfCache,
  ) {}

  async pdf(member: MemberContext, id: number) {
    const plan = await this.plans.findOne(member, id);
    return { filename: filenameOf(plan, 'pdf'), body: await this.pdfs.pdf(plan) };
  }

  async csv(member: MemberContext, id: number) {
    const plan = await this.plans.findOne(member, id);
    return { filename: filenameOf(plan, 'csv'), body: renderReviewPlanCsv(plan) };
  }

  /**
   * E-mails the PDF to each chosen member. Every recipient is checked first (a member of
   * this household, and a tutor only when given this student), so a bad id sends nothing.
   */
  async send(member: MemberContext, id: number, dto: SendReviewPlanDto, origin: string) {
    const plan = await this.plans.findOne(member, id);
    const recipients = [];
    const errors: Record<string, string> = {};
    for (const [index, memberId] of dto.memberIds.entries()) {
      const target = await this.members.findOne(member, memberId);
      if (target.role === Role.tutor && !(target.studentIds ?? []).includes(plan.studentId))
        errors[`memberIds.${index}`] =
          `${target.displayName} is a tutor not given ${plan.student.name}`;
      recipients.push(target);
    }
    if (Object.keys(errors).length) throw fieldsError(errors);
    const pdf = await this.pdfs.pdf(plan);
    const household = await this.households.findCurrent(member);
    const sender = (await this.users.findById(member.userId))?.displayName ?? 'A member';
    const filename = filenameOf(plan, 'pdf');
    for (const r of recipients) {
      await this.mail.send({
        to: r.email,
        subject: `Review plan for ${plan.student.name}, ${writtenDate(plan.scheduledFor)}`,
        paragraphs: [
          `Hello ${r.displayName},`,
          `${sender} sent you the review plan for ${plan.student.name} for ${writtenDate(plan.scheduledFor)}: ` +
            `${plan.progress.total} items to work through, attached as a PDF to print. ` +
            'Its first page is a summary: the lessons, the facts and the problems most worth re-working.',
          ...(plan.summary.lessons.length > 0
            ? [
                `Lessons to revisit: ${plan.summary.lessons.map((l) => l.replace(/^Revisit l/, 'L')).join('; ')}.`,
              ]
            : []),
          ...(dto.message ? [`${sender} adds: ${dto.message}`] : []),
          `Where the answers are: at the end of the PDF, from the page headed “Answers”. Keep those pages apart while the problems are worked.`,
        ],
        action: { label: 'Open the plan in Workback', url: `${origin}/review-plans/${plan.id}` },
        sentBy: `${sender}, of ${household.name}`,
        reason: `because ${sender} chose to send this plan to you as a member of ${household.name}`,
        attachments: [{ filename, content: pdf, contentType: 'application/pdf' }],
      });
    }
    return { sent: recipients.map((r) => ({ memberId: r.id, displayName: r.displayName })) };
  }
}

function filenameOf(plan: { id: number; scheduledFor: string }, ext: string): string {
  return `review-plan-${plan.id}-${plan.scheduledFor}.${ext}`;
}

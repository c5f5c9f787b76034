import { Button, Callout, Intent, ProgressBar } from '@blueprintjs/core';
import { DocumentIcon, EnvelopeIcon, PrintIcon } from '@blueprintjs/icons';
import type { PlanItemKind } from '@workback/core';
import { useMemo, useState } from 'react';

import { CalmDayCallout } from '../../../components/calm-day-callout';
import { ErrorState, LoadingState } from '../../../components/states';
import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { useCheckPlanItem } from '../api/check-plan-item';
import { useDownloadReviewPlan, type PlanFormat } from '../api/download-review-plan';
import { useReviewPlan } from '../api/get-review-plan';
import { longDay, type PlanItem } from '../types';
import { PlanItemRow } from './plan-item';
import { PlanSummary } from './plan-summary';
import { SendPlanDialog } from './send-plan-dialog';

import '../review-plans.css';

const SECTIONS: readonly { kind: PlanItemKind; title: string; intro: string }[] = [
  {
    kind: 'lesson',
    title: 'Lessons to revisit',
    intro: 'Go back over these lessons first; they teach the ideas behind the misses.',
  },
  {
    kind: 'fact-family',
    title: 'Fact families to drill',
    intro: 'A few minutes a day for facts that are not automatic yet.',
  },
  {
    kind: 'practice',
    title: 'Fresh practice problems',
    intro:
      'New problems that need the same steps. The answers come last in the PDF, from the page headed “Answers”.',
  },
  {
    kind: 'miss',
    title: 'Problems to re-work',
    intro: 'Ask the child to work each one again and say out loud how they solve it.',
  },
];

/** A review plan: its checklist by section, downloads, and e-mail for owners and parents. */
export function PlanView({ planId, canSend }: { planId: number; canSend: boolean }) {
  const plan = useReviewPlan(planId);
  const check = useCheckPlanItem();
  const download = useDownloadReviewPlan();
  const toast = useToast();
  const [sending, setSending] = useState(false);
  const [pendingItem, setPendingItem] = useState<number | null>(null);
  const missById = useMemo(
    () => new Map((plan.data?.misses ?? []).map((m) => [m.id, m])),
    [plan.data],
  );

  if (plan.isPending) return <LoadingState label="Opening the review plan…" />;
  if (plan.isError) {
    return (
      <ErrorState
        title="The review plan could not be opened."
        error={plan.error}
        onRetry={() => void plan.refetch()}
      />
    );
  }
  const p = plan.data;

  const onCheck = (item: PlanItem, done: boolean) => {
    setPendingItem(item.id);
    check.mutate(
      { planId: p.id, itemId: item.id, done },
      {
        onSettled: () => setPendingItem(null),
        onError: (error) =>
          toast(
            isApiError(error) ? `Not saved: ${error.message}` : 'Not saved. Please try again.',
            Intent.WARNING,
          ),
      },
    );
  };

  const fetchFile = (format: PlanFormat) =>
    download.mutate(
      { planId: p.id, format },
      {
        onSuccess: (file) => toast(`Downloading ${file.filename}.`),
        onError: (error) =>
          toast(
            isApiError(error)
              ? `The download did not work: ${error.message}`
              : 'The download did not work. Please try again.',
            Intent.WARNING,
          ),
      },
    );

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Review plan for {p.student.name}</h1>
          <p className="wb-muted">
            Review on {longDay(p.scheduledFor)} ·{' '}
            {p.misses.length === 1 ? '1 miss' : `${p.misses.length} misses`}
          </p>
        </div>
        <div className="wb-plan-actions">
          <Button
            icon={<PrintIcon />}
            intent={Intent.PRIMARY}
            loading={download.isPending && download.variables?.format === 'pdf'}
            onClick={() => fetchFile('pdf')}
          >
            Download PDF
          </Button>
          <Button
            icon={<DocumentIcon />}
            variant="outlined"
            loading={download.isPending && download.variables?.format === 'csv'}
            onClick={() => fetchFile('csv')}
          >
            Download CSV
          </Button>
          {canSend ? (
            <Button icon={<EnvelopeIcon />} variant="outlined" onClick={() => setSending(true)}>
              Send by e-mail
            </Button>
          ) : null}
        </div>
      </div>
      {p.warning ? <CalmDayCallout what="This review" /> : null}
      {p.notes.length > 0 ? (
        <Callout className="wb-callout" title="About this plan">
          {p.notes.map((note) => (
            <p key={note}>{note}</p>
          ))}
        </Callout>
      ) : null}
      <PlanSummary summary={p.summary} />
      <div className="wb-plan-progress wb-plan-progress-wide">
        <span>
          {p.progress.done} of {p.progress.total} done
          {p.status === 'done' ? ' — the whole plan is done' : ''}
        </span>
        <ProgressBar
          value={p.progress.total ? p.progress.done / p.progress.total : 0}
          animate={false}
          stripes={false}
          aria-label={`${p.progress.done} of ${p.progress.total} items done`}
        />
      </div>
      <h2 className="wb-section-title">The whole plan</h2>
      <p className="wb-muted">
        Tick each item when it is done. A miss counts as resolved once every item for it is ticked.
      </p>
      {SECTIONS.map((section) => {
        const items = p.items.filter((i) => i.kind === section.kind);
        if (items.length === 0) return null;
        return (
          <section
            key={section.kind}
            className="wb-plan-section"
            aria-labelledby={`plan-${section.kind}`}
          >
            <h2 id={`plan-${section.kind}`} className="wb-section-title">
              {section.title}
            </h2>
            <p className="wb-muted wb-section-intro">{section.intro}</p>
            <ul className="wb-plan-items">
              {items.map((item) => (
                <PlanItemRow
                  key={item.id}
                  item={item}
                  missById={missById}
                  pending={pendingItem === item.id}
                  onCheck={(done) => onCheck(item, done)}
                />
              ))}
            </ul>
          </section>
        );
      })}
      <SendPlanDialog planId={p.id} open={sending} onClose={() => setSending(false)} />
    </>
  );
}

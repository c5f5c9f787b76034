import { Button, Checkbox } from '@blueprintjs/core';
import {
  INTERVIEW_STAGE_GUIDE,
  type FactFamilyDrill,
  type LessonRange,
  type PracticeBlock,
} from '@workback/core';
import { useState } from 'react';
import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { shortDay, type PlanItem, type PlanMiss, type PlanMissPayload } from '../types';

function misses(count: number) {
  return count === 1 ? '1 miss' : `${count} misses`;
}

function PracticeProblems({ block }: { block: PracticeBlock }) {
  const [answers, setAnswers] = useState(false);
  return (
    <div className="wb-practice">
      <ol className="wb-practice-list">
        {block.problems.map((p) => (
          <li key={p.number} value={p.number}>
            <span className="wb-mono">{p.problem}</span>
            {answers ? <span className="wb-mono wb-practice-answer"> = {p.answer}</span> : null}
          </li>
        ))}
      </ol>
      <Button
        size="small"
        variant="minimal"
        onClick={() => setAnswers((on) => !on)}
        aria-pressed={answers}
      >
        {answers ? 'Hide the answers' : 'Show the answers'}
      </Button>
    </div>
  );
}

/** A word problem's number sentences with their verdicts, the first that differs marked softly. */
function PlanLines({ miss }: { miss: PlanMiss }) {
  if (!miss.lines && !miss.stage) return null;
  const stage = miss.stage ? INTERVIEW_STAGE_GUIDE[miss.stage] : null;
  return (
    <div className="wb-plan-lines">
      {miss.lines ? (
        <ol className="wb-plan-line-list" aria-label="Number sentences">
          {miss.lines.map((l) => (
            <li
              key={l.line}
              className={
                l.line === miss.firstWrongLine ? 'wb-plan-line wb-plan-line-first' : 'wb-plan-line'
              }
            >
              <span className="wb-plan-line-number">{l.line}.</span>
              <span className="wb-mono">{l.text}</span>
              {l.verdict ? <span className="wb-plan-line-verdict">{l.verdict}</span> : null}
            </li>
          ))}
        </ol>
      ) : null}
      {stage ? (
        <p className="wb-muted">
          Where it went wrong: “{stage.prompt}” ({stage.stage.toLowerCase()}).
        </p>
      ) : null}
    </div>
  );
}

/** The partial products or division lines the child wrote, beside the usual ones. */
function PlanWrittenSteps({ miss }: { miss: PlanMiss }) {
  const written = miss.writtenSteps;
  if (!written || written.steps.length === 0) return null;
  const what = written.kind === 'partials' ? 'partial products' : 'division lines';
  return (
    <div className="wb-plan-lines">
      <p className="wb-muted">The {what} the child wrote, beside the usual ones:</p>
      <ul className="wb-plan-line-list" aria-label={`The ${what} the child wrote`}>
        {written.steps.map((s, i) => {
          const first = written.firstDiffers === i;
          return (
            <li
              key={s.label}
              className={
                first ? 'wb-plan-line wb-plan-step wb-plan-line-first' : 'wb-plan-line wb-plan-step'
              }
            >
              <span>
                {s.label}
                {s.work ? ` (${s.work})` : ''}: wrote{' '}
                <span className="wb-mono">{s.written || 'nothing'}</span> · usual{' '}
                <span className="wb-mono">{s.expected || 'none'}</span> ·{' '}
                {s.ok ? 'same' : first ? 'the first that differs' : 'differs'}
              </span>
            </li>
          );
        })}
      </ul>
    </div>
  );
}

function ItemBody({ item, missById }: { item: PlanItem; missById: Map<number, PlanMiss> }) {
  switch (item.kind) {
    case 'lesson': {
      const range = item.payload as LessonRange;
      return <span className="wb-muted">For {misses(range.missIds.length)}</span>;
    }
    case 'fact-family': {
      const drill = item.payload as FactFamilyDrill;
      return (
        <div>
          <span className="wb-mono">{drill.facts.join(', ')}</span>
          <p className="wb-activity">
            <strong>{drill.activity.title}.</strong> {drill.activity.how}
          </p>
          {drill.alternatives?.length ? (
            <details className="wb-plan-alternatives">
              <summary>Other ways to practise on other days</summary>
              {drill.alternatives.map((a) => (
                <p key={a.id} className="wb-activity">
                  <strong>{a.title}.</strong> {a.how}
                </p>
              ))}
            </details>
          ) : null}
        </div>
      );
    }
    case 'practice':
      return <PracticeProblems block={item.payload as PracticeBlock} />;
    default: {
      const payload = item.payload as PlanMissPayload;
      const miss = missById.get(payload.missId);
      return (
        <div>
          <span className="wb-muted">
            Wrote <span className="wb-mono">{payload.answer}</span>
            {miss?.expected ? (
              <>
                {' '}
                (the answer is <span className="wb-mono">{miss.expected}</span>)
              </>
            ) : null}{' '}
            on {shortDay(payload.occurredOn)} ·{' '}
            <Link to={paths.app.miss.getHref(payload.missId)}>open the miss</Link>
          </span>
          {miss?.explanation ? <p className="wb-activity">“{miss.explanation}”</p> : null}
          {miss ? <PlanWrittenSteps miss={miss} /> : null}
          {miss ? <PlanLines miss={miss} /> : null}
        </div>
      );
    }
  }
}

/** One line of the checklist: a tick, what to do, and the details that go with it. */
export function PlanItemRow({
  item,
  missById,
  pending,
  onCheck,
}: {
  item: PlanItem;
  missById: Map<number, PlanMiss>;
  pending: boolean;
  onCheck: (done: boolean) => void;
}) {
  const title =
    item.kind === 'miss' ? `Re-work ${(item.payload as PlanMissPayload).problem}` : item.title;
  return (
    <li className={item.done ? 'wb-plan-item wb-plan-item-done' : 'wb-plan-item'}>
      <Checkbox
        checked={item.done}
        disabled={pending}
        onChange={(e) => onCheck(e.currentTarget.checked)}
        size="large"
        labelElement={<span className="wb-plan-item-title">{title}</span>}
      />
      <div className="wb-plan-item-body">
        <ItemBody item={item} missById={missById} />
      </div>
    </li>
  );
}

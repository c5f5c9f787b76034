import { Card, Tag } from '@blueprintjs/core';
import type { Difficulty } from '@workback/core';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { notebookHref } from '../notebook-link';
import { recurringSentence, shortDay, type PatternsResult } from '../types';
import { PatternNotes } from './pattern-notes';

type Card = PatternsResult['difficulties'][number];

/** What the app offers on a card (a check-up of a method not yet settled). */
export type CardActions = (card: Card, studentId: number) => ReactNode;

const STATUS: Readonly<Record<Difficulty['status'], { tag: string; className: string }>> = {
  finding: { tag: 'Finding', className: 'wb-finding-tag' },
  recurring: { tag: 'Keeps coming back', className: 'wb-recurring-tag' },
  possible: { tag: 'Possible', className: 'wb-possible-tag' },
};

const REVIEW: Readonly<Record<'not-reviewed' | 'faded' | 'seen-again', string>> = {
  'not-reviewed': 'Not on a review plan yet',
  faded: 'Faded since the review',
  'seen-again': 'Seen again since the review',
};

const SHOWN = 4;

/**
 * Where “see them all” leads: the notebook filtered by the card's rule, by its family of rules
 * (`rule=group:zero-regrouping`, however many rules and skills its misses carry), or by its
 * skill. A fact family has no notebook filter: its card unfolds the rest in place.
 */
function allHref(card: Card, p: PatternsResult): string | null {
  const base = { studentId: p.studentId, from: p.from, to: p.to };
  if (card.kind === 'method') {
    const rule = card.key.startsWith('group:') ? card.key : card.ruleIds[0];
    return rule ? notebookHref({ ...base, rule }) : null;
  }
  if (card.kind === 'skill' && card.skills[0])
    return notebookHref({ ...base, skill: card.skills[0] });
  return null;
}

function DifficultyCard({
  card,
  patterns,
  name,
  actions,
}: {
  card: Card;
  patterns: PatternsResult;
  name: string;
  actions?: CardActions | undefined;
}) {
  const status = STATUS[card.status];
  const href = allHref(card, patterns);
  const review = card.recurring?.status ?? null;
  return (
    <Card className="wb-difficulty-card">
      <div className="wb-finding-head">
        <Tag minimal round className={status.className}>
          {status.tag}
        </Tag>
        <h3 className="wb-finding-title">{card.title}</h3>
      </div>
      {card.recurring ? (
        <p className="wb-recurring-line">
          <span className="wb-recurring-sentence">{recurringSentence(name, card.recurring)}</span>
        </p>
      ) : null}
      <p className="wb-difficulty-sentence">{card.sentence}</p>
      {card.skills.length > 0 ? (
        <p className="wb-muted wb-difficulty-skills">
          Skill{card.skills.length === 1 ? '' : 's'}: {card.skills.join(', ')}
        </p>
      ) : null}
      {review ? (
        <p className="wb-recurring-meta">
          <Tag minimal round className={`wb-status-tag wb-status-${review}`}>
            {REVIEW[review]}
          </Tag>{' '}
          {card.recurring?.sincePlan ? (
            <Link to={paths.app.reviewPlan.getHref(card.recurring.sincePlan.planId)}>
              Open that review plan
            </Link>
          ) : null}
        </p>
      ) : null}
      <ul className="wb-evidence" aria-label={`The problems: ${card.title}`}>
        {card.evidence.slice(0, SHOWN).map((e) => (
          <li key={e.missId}>
            <Link to={paths.app.miss.getHref(e.missId)} className="wb-mono">
              {e.problem}
            </Link>
            <span className="wb-muted">
              {' '}
              · wrote <span className="wb-mono">{e.answer}</span> · {shortDay(e.occurredOn)}
            </span>
          </li>
        ))}
        {card.evidence.length > SHOWN ? (
          <li className="wb-muted">
            {href ? (
              <Link to={href}>See all {card.evidence.length} in the notebook</Link>
            ) : (
              <details>
                <summary>and {card.evidence.length - SHOWN} more</summary>
                <ul className="wb-evidence">
                  {card.evidence.slice(SHOWN).map((e) => (
                    <li key={e.missId}>
                      <Link to={paths.app.miss.getHref(e.missId)} className="wb-mono">
                        {e.problem}
                      </Link>
                      <span className="wb-muted">
                        {' '}
                        · wrote <span className="wb-mono">{e.answer}</span> ·{' '}
                        {shortDay(e.occurredOn)}
                      </span>
                    </li>
                  ))}
                </ul>
              </details>
            )}
          </li>
        ) : null}
      </ul>
      {card.contradictions.length > 0 ? (
        <details className="wb-details wb-contradictions">
          <summary>
            {card.contradictions.length === 1
              ? `1 answer ${name} got right goes against it`
              : `${card.contradictions.length} answers ${name} got right go against it`}
          </summary>
          <ul className="wb-evidence">
            {card.contradictions.slice(0, SHOWN).map((c) => (
              <li key={`${c.occurredOn}-${c.problem}`}>
                <span className="wb-mono">
                  {c.problem} = {c.answer}
                </span>{' '}
                <span className="wb-muted">
                  (the method writes <span className="wb-mono">{c.ruleWrites}</span>,{' '}
                  {shortDay(c.occurredOn)})
                </span>
              </li>
            ))}
          </ul>
        </details>
      ) : null}
      {actions?.(card, patterns.studentId)}
      <PatternNotes
        studentId={patterns.studentId}
        patternKey={card.patternKeys[0] ?? card.key}
        label={card.title}
        notes={card.notes}
      />
    </Card>
  );
}

/**
 * One card per difficulty, most telling first: findings, then what keeps coming back, then
 * (folded away) what was seen only once or twice.
 */
export function DifficultyCards({
  patterns,
  studentName,
  actions,
}: {
  patterns: PatternsResult;
  studentName: string;
  actions?: CardActions | undefined;
}) {
  const main = patterns.difficulties.filter((d) => d.status !== 'possible');
  const possible = patterns.difficulties.filter((d) => d.status === 'possible');
  if (patterns.difficulties.length === 0) {
    return (
      <p className="wb-empty-line">
        Nothing recurs yet and no written-method rule explains these misses. Log misses after each
        worksheet and difficulties show up here.
      </p>
    );
  }
  return (
    <>
      {main.length === 0 ? (
        <p className="wb-empty-line">
          Nothing has come back three times within a month, and no method is a finding yet.
        </p>
      ) : (
        <ul className="wb-cards wb-difficulties" aria-label="Difficulties">
          {main.map((d) => (
            <li key={d.key}>
              <DifficultyCard card={d} patterns={patterns} name={studentName} actions={actions} />
            </li>
          ))}
        </ul>
      )}
      {possible.length > 0 ? (
        <details className="wb-details wb-possible">
          <summary>
            Seen only once or twice ({possible.length}{' '}
            {possible.length === 1 ? 'difficulty' : 'difficulties'}): possible, not findings
          </summary>
          <ul className="wb-cards wb-difficulties" aria-label="Possible difficulties">
            {possible.map((d) => (
              <li key={d.key}>
                <DifficultyCard card={d} patterns={patterns} name={studentName} actions={actions} />
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </>
  );
}

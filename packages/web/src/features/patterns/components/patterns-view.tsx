import { Callout } from '@blueprintjs/core';
import { HeatGridIcon, InfoSignIcon } from '@blueprintjs/icons';
import { useEffect, useState, type ReactNode } from 'react';

import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { usePatterns } from '../api/get-patterns';
import { rangeOf } from '../period';
import type { StudentRef } from '../types';
import { CauseMixChart } from './cause-mix-chart';
import { FactGrid } from './fact-grid';
import { DifficultyCards, type CardActions } from './difficulty-cards';
import { PatternFilters, type PatternFilterValues } from './pattern-filters';
import { SkillCounts } from './skill-counts';
import { TopRulesChart } from './top-rules-chart';

import '../patterns.css';

function Section({
  id,
  title,
  intro,
  children,
}: {
  id: string;
  title: string;
  intro?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section className="wb-pattern-section" aria-labelledby={id}>
      <h2 id={id} className="wb-section-title">
        {title}
      </h2>
      {intro ? <p className="wb-muted wb-section-intro">{intro}</p> : null}
      {children}
    </section>
  );
}

const WIDE_QUERY = '(min-width: 720px)';

/**
 * A section folded on a phone (details on demand) and open on a wide screen; it follows the
 * width when the window crosses it, and otherwise keeps what the reader chose.
 */
function MoreSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  const [open, setOpen] = useState(() => window.matchMedia?.(WIDE_QUERY).matches ?? true);
  useEffect(() => {
    const query = window.matchMedia?.(WIDE_QUERY);
    if (!query) return;
    const follow = () => setOpen(query.matches);
    query.addEventListener('change', follow);
    return () => query.removeEventListener('change', follow);
  }, []);
  return (
    <details
      className="wb-pattern-more"
      open={open}
      onToggle={(e) => setOpen(e.currentTarget.open)}
    >
      <summary>
        <h2 id={id} className="wb-section-title wb-more-title">
          {title}
        </h2>
      </summary>
      <section aria-labelledby={id}>{children}</section>
    </details>
  );
}

/**
 * The Patterns page body: for one student over a period, what keeps coming back first, then
 * what the checkers found across problems, the fact gaps, and the causes and rules over time.
 */
export function PatternsView({
  students,
  filters,
  onChange,
  cardActions,
}: {
  students: readonly StudentRef[];
  filters: PatternFilterValues;
  onChange: (changes: Partial<PatternFilterValues>) => void;
  /** What the app offers on each difficulty card (a check-up). */
  cardActions?: CardActions;
}) {
  const range = rangeOf(filters.period, filters);
  const patterns = usePatterns({ studentId: filters.studentId, ...range });
  const student = students.find((s) => s.id === filters.studentId);
  const name = student?.name ?? 'This student';

  let body: ReactNode;
  if (patterns.isPending) {
    body = <LoadingState label={`Looking over ${name}’s misses…`} />;
  } else if (patterns.isError) {
    body = (
      <ErrorState
        title="The patterns could not be worked out."
        error={patterns.error}
        onRetry={() => void patterns.refetch()}
      />
    );
  } else if (patterns.data.missCount === 0) {
    body = (
      <EmptyState
        icon={<HeatGridIcon size={40} />}
        title={`No misses logged for ${name} in this period. Log misses after each worksheet, or choose a longer period.`}
      />
    );
  } else {
    const p = patterns.data;
    body = (
      <>
        <Callout icon={<InfoSignIcon />} className="wb-callout wb-patterns-caution">
          {p.caution} Based on {p.missCount === 1 ? '1 miss' : `${p.missCount} misses`}
          {p.rightItemCount > 0 ? ` and ${p.rightItemCount} items ${name} got right` : ''}.
        </Callout>
        <Section
          id="patterns-difficulties"
          title="What to look at first"
          intro={`One card per difficulty. A card is a finding when one known wrong method reproduces 2 or more of ${name}’s answers exactly and none of the answers ${name} got right goes against it; it keeps coming back when it was seen 3 or more times within 30 days.`}
        >
          <DifficultyCards patterns={p} studentName={name} actions={cardActions} />
        </Section>
        <MoreSection id="patterns-facts" title="Fact gaps">
          <p className="wb-muted wb-section-intro">
            Basic facts the checkers found wrong inside the written working.
          </p>
          {p.facts.list.length > 0 ? (
            <FactGrid facts={p.facts} />
          ) : (
            <p className="wb-empty-line">No basic fact was found wrong in this period.</p>
          )}
        </MoreSection>
        <MoreSection id="patterns-causes" title="Causes over time">
          <CauseMixChart weeks={p.causeMix} studentId={p.studentId} />
        </MoreSection>
        {p.rules.length > 0 ? (
          <MoreSection id="patterns-rules" title="Error rules seen most">
            <TopRulesChart rules={p.rules} studentId={p.studentId} from={p.from} to={p.to} />
          </MoreSection>
        ) : null}
        <MoreSection id="patterns-skills" title="Skills with the most misses">
          <SkillCounts skills={p.skills} studentId={p.studentId} from={p.from} to={p.to} />
        </MoreSection>
      </>
    );
  }

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Patterns</h1>
          <p className="wb-muted">
            What keeps coming back in {name}’s work across weeks, to decide what to review next.
          </p>
        </div>
      </div>
      <PatternFilters students={students} value={filters} onChange={onChange} />
      {body}
    </>
  );
}

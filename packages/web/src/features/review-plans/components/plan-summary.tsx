import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { shortDay, type PlanSummaryJson } from '../types';

/**
 * What to do first, before the whole checklist: the lessons (with their titles), the facts
 * to drill and the 3–5 problems most worth re-working, each with why it was chosen.
 */
export function PlanSummary({ summary }: { summary: PlanSummaryJson }) {
  return (
    <section className="wb-plan-summary" aria-labelledby="plan-summary">
      <h2 id="plan-summary" className="wb-section-title">
        Start here
      </h2>
      <div className="wb-plan-summary-grid">
        <div>
          <h3 className="wb-plan-summary-head">Lessons to revisit</h3>
          {summary.lessons.length === 0 ? (
            <p className="wb-muted">No lessons named for these misses.</p>
          ) : (
            <ul className="wb-plan-summary-list">
              {summary.lessons.map((l) => (
                <li key={l}>{l.replace(/^Revisit l/, 'L')}</li>
              ))}
            </ul>
          )}
        </div>
        <div>
          <h3 className="wb-plan-summary-head">Facts to drill</h3>
          {summary.facts.length === 0 ? (
            <p className="wb-muted">No basic facts were wrong in these misses.</p>
          ) : (
            <ul className="wb-plan-summary-list">
              {summary.facts.map((f) => (
                <li key={f}>{f}</li>
              ))}
            </ul>
          )}
        </div>
      </div>
      <h3 className="wb-plan-summary-head">Problems most worth re-working</h3>
      <ol className="wb-plan-focus" aria-label="Problems most worth re-working">
        {summary.focus.map((f) => (
          <li key={f.missId}>
            <Link to={paths.app.miss.getHref(f.missId)} className="wb-mono wb-plan-focus-problem">
              {f.problem}
            </Link>
            <span className="wb-muted">
              {' '}
              · child wrote <span className="wb-mono">{f.answer}</span>
              {f.expected ? (
                <>
                  {' '}
                  · right answer <span className="wb-mono">{f.expected}</span>
                </>
              ) : null}{' '}
              · {shortDay(f.occurredOn)}
            </span>
            <p className="wb-plan-focus-reason">{f.reason}</p>
          </li>
        ))}
      </ol>
    </section>
  );
}

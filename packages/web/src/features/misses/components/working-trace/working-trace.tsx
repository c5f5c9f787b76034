import { groupThousands, type Diagnosis } from '@workback/core';

import { ruleTitle } from '../../types';
import { ChecksSection } from './checks';
import { PAPER_KINDS, RightAlignedDrawing, TraceDrawing } from './trace-drawing';
import { WrittenSteps } from './written-steps';

const OP_SIGN: Record<string, string> = { '+': '+', '-': '−', x: '×', '÷': '÷' };

/** The note shown wherever the engine's findings are: it aids the parent, it does not grade. */
export function CheckersCaution() {
  return (
    <p className="wb-trace-caution">
      The checkers show one way this answer could have come about. They help your judgement; they
      are not a grade or an assessment of your child.
    </p>
  );
}

/**
 * The working trace: the child's working (pencil) beside the usual one (ink) on squared paper,
 * the first column where they differ softly shaded, the error rule in plain words, the checks
 * folded away under it.
 */
export function WorkingTrace({ diagnosis }: { diagnosis: Diagnosis }) {
  const { trace, firstWrongStep, rules, facts, notes, checks } = diagnosis;
  const place = firstWrongStep?.place ?? null;
  const [best, ...others] = rules;

  if (diagnosis.correct) {
    return (
      <section className="wb-trace" aria-label="Working trace">
        <p className="wb-trace-verdict">
          This answer is right:{' '}
          <span className="wb-mono">{groupThousands(diagnosis.expected)}</span>.
        </p>
        {notes.map((note) => (
          <p key={note} className="wb-trace-note">
            {note}
          </p>
        ))}
        <figure className="wb-trace-panel is-usual">
          <figcaption>The usual working</figcaption>
          <TraceDrawing trace={trace.expected} label="The usual working" showCheck />
        </figure>
        <ChecksSection nines={checks.nines} elevens={checks.elevens} />
      </section>
    );
  }

  // dec.right-aligned has no working of its own: drawn from the problem, lined up as the child did.
  const rightAligned =
    !trace.child && best?.ids.includes('dec.right-aligned') && diagnosis.problem.kind === 'decimal'
      ? diagnosis.problem
      : null;
  const childLabel =
    trace.child || rightAligned
      ? 'The child’s working, as this rule does it'
      : 'The child’s answer';
  return (
    <section className="wb-trace" aria-label="Working trace">
      <p className="wb-trace-verdict">
        The usual working gives{' '}
        <span className="wb-mono">{groupThousands(diagnosis.expected)}</span>; the answer written is{' '}
        <span className="wb-mono">{diagnosis.answer}</span>.
      </p>
      <div className="wb-trace-panels">
        <figure className="wb-trace-panel is-child">
          <figcaption>{childLabel}</figcaption>
          {trace.child ? (
            <TraceDrawing trace={trace.child.working} label={childLabel} differsPlace={place} />
          ) : rightAligned ? (
            <RightAlignedDrawing
              problem={rightAligned}
              answer={diagnosis.answer}
              label={childLabel}
            />
          ) : PAPER_KINDS.has(trace.expected.kind) ? (
            <TraceDrawing
              trace={trace.expected}
              label={childLabel}
              differsPlace={place}
              answer={diagnosis.answer}
            />
          ) : (
            <p className="wb-trace-bare wb-mono" aria-label={childLabel}>
              {diagnosis.answer}
            </p>
          )}
        </figure>
        <figure className="wb-trace-panel is-usual">
          <figcaption>The usual working</figcaption>
          <TraceDrawing
            trace={trace.expected}
            label="The usual working"
            differsPlace={place}
            showCheck
          />
        </figure>
      </div>
      {diagnosis.writtenSteps && diagnosis.writtenSteps.steps.length > 0 ? (
        <WrittenSteps report={diagnosis.writtenSteps} />
      ) : null}
      {firstWrongStep ? (
        <p className="wb-trace-where">
          <span className="wb-trace-swatch" aria-hidden="true" />
          <strong>Where it went differently:</strong> {firstWrongStep.note}
        </p>
      ) : null}
      {best ? (
        <div className="wb-trace-rule">
          <h3 className="wb-trace-rule-title">{ruleTitle(best.id)}</h3>
          <p>{best.explanation}</p>
          {others.length > 0 ? (
            <>
              <p className="wb-muted">The answer can also come about this way:</p>
              <ul className="wb-trace-others">
                {others.map((rule) => (
                  <li key={rule.id}>
                    <strong>{ruleTitle(rule.id)}.</strong> {rule.explanation}
                  </li>
                ))}
              </ul>
            </>
          ) : null}
        </div>
      ) : (
        <p className="wb-trace-rule">
          None of the known step errors gives exactly this answer, so it may be a one-off. Ask the
          child to talk you through it.
        </p>
      )}
      {facts.length > 0 ? (
        <p className="wb-trace-facts">
          Basic facts to look at:{' '}
          {facts.map((f, i) => (
            <span key={i} className="wb-mono">
              {i > 0 ? ', ' : ''}
              {f.a} {OP_SIGN[f.op] ?? f.op} {f.b} = {f.expected} (taken as {f.written})
            </span>
          ))}
        </p>
      ) : null}
      {notes.map((note) => (
        <p key={note} className="wb-trace-note">
          {note}
        </p>
      ))}
      <ChecksSection nines={checks.nines} elevens={checks.elevens} />
      <CheckersCaution />
    </section>
  );
}

import { Button, Collapse } from '@blueprintjs/core';
import { ChevronDownIcon, ChevronRightIcon } from '@blueprintjs/icons';
import type { CheckResult } from '@workback/core';
import { useId, useState } from 'react';

const TITLE = { nines: 'Casting out nines', elevens: 'Casting out elevens' } as const;

function CheckBlock({ check }: { check: CheckResult }) {
  if (!check.applies) {
    return (
      <div className="wb-check">
        <h4 className="wb-check-title">{TITLE[check.method]}</h4>
        <p className="wb-muted">{check.reason}</p>
      </div>
    );
  }
  return (
    <div className="wb-check">
      <h4 className="wb-check-title">
        {TITLE[check.method]}: {check.passes ? 'the sides agree' : 'the sides differ'}
      </h4>
      <ul className="wb-check-numbers">
        {check.numbers.map((n) => (
          <li key={n.number}>
            <span className="wb-mono">{n.number}</span> →{' '}
            <span className="wb-mono">{n.working.join(', ')}</span> → leaves{' '}
            <span className="wb-mono">{n.residue}</span>
          </li>
        ))}
      </ul>
      <p>
        Problem side: <span className="wb-mono">{check.problemSide.working}</span>; answer side:{' '}
        <span className="wb-mono">{check.answerSide.working}</span>.
      </p>
      <p>{check.verdict}</p>
      {check.warnings.map((w) => (
        <p key={w} className="wb-muted">
          {w}
        </p>
      ))}
      <p className="wb-check-caveat">{check.caveat}</p>
    </div>
  );
}

/** The nines and elevens checks, folded away until asked for. */
export function ChecksSection({ nines, elevens }: { nines: CheckResult; elevens: CheckResult }) {
  const [open, setOpen] = useState(false);
  const id = useId();
  return (
    <div className="wb-checks">
      <Button
        variant="minimal"
        icon={open ? <ChevronDownIcon /> : <ChevronRightIcon />}
        aria-expanded={open}
        aria-controls={id}
        onClick={() => setOpen((value) => !value)}
      >
        Quick checks: casting out nines and elevens
      </Button>
      <Collapse isOpen={open} keepChildrenMounted>
        <div id={id} className="wb-checks-body">
          <p className="wb-muted">
            Casting out nines: add up the digits of each number until one digit is left, work the
            problem with those digits, and compare with the answer’s digit sum. Elevens do the same
            with alternating sums. When the sides differ the answer is wrong; when they agree it is
            only likely right.
          </p>
          <CheckBlock check={nines} />
          <CheckBlock check={elevens} />
        </div>
      </Collapse>
    </div>
  );
}

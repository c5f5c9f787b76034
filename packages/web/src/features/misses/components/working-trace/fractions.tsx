import type { Fraction, FractionComparisonTrace, FractionSumTrace } from '@workback/core';
import { Fragment, type ReactNode } from 'react';

type Part = 'numerator' | 'denominator';

/** A fraction written with its bar, as on paper; the slash is there for screen readers and copying. */
export function FractionFigure({
  fraction,
  differs,
}: {
  fraction: Fraction;
  differs?: Part | 'whole' | null;
}) {
  const mark = (part: Part) =>
    differs === part || differs === 'whole' ? 'wb-frac-part is-differs' : 'wb-frac-part';
  return (
    <span className="wb-frac">
      <span className={mark('numerator')}>{fraction.numerator}</span>
      <span className="wb-sr-only">/</span>
      <span className={mark('denominator')}>{fraction.denominator}</span>
    </span>
  );
}

function Chain({ items, label }: { items: readonly ReactNode[]; label: string }) {
  return (
    <p className="wb-frac-chain" aria-label={label}>
      {items.map((item, i) => (
        <Fragment key={i}>
          {i > 0 ? <span className="wb-frac-eq">=</span> : null}
          <span className="wb-frac-step">{item}</span>
        </Fragment>
      ))}
    </p>
  );
}

const partOf = (place: string | null | undefined): Part | null =>
  place === 'numerator' || place === 'denominator' ? place : null;

/** Adding or subtracting fractions: over a common denominator (when found), then simplified. */
export function FractionSumDrawing({
  trace,
  differsPlace,
  label,
}: {
  trace: FractionSumTrace;
  differsPlace?: string | null;
  label: string;
}) {
  const items: ReactNode[] = [
    <>
      <FractionFigure fraction={trace.left} /> <span className="wb-frac-op">{trace.op}</span>{' '}
      <FractionFigure fraction={trace.right} />
    </>,
  ];
  if (trace.leftScaled && trace.rightScaled && trace.commonDenominator !== null) {
    items.push(
      <>
        <FractionFigure fraction={trace.leftScaled} />
        <span className="wb-frac-factor">×{trace.leftScaled.factor}</span>{' '}
        <span className="wb-frac-op">{trace.op}</span>{' '}
        <FractionFigure fraction={trace.rightScaled} />
        <span className="wb-frac-factor">×{trace.rightScaled.factor}</span>
      </>,
    );
  }
  const simplifies = trace.simplified.divisor > 1;
  const finalDiffers = partOf(differsPlace);
  items.push(
    <FractionFigure
      fraction={trace.unsimplified}
      differs={simplifies || trace.mixed ? null : finalDiffers}
    />,
  );
  if (simplifies) {
    items.push(
      <>
        <FractionFigure fraction={trace.simplified} differs={trace.mixed ? null : finalDiffers} />
        <span className="wb-frac-factor">÷{trace.simplified.divisor}</span>
      </>,
    );
  }
  if (trace.mixed) {
    items.push(<span className={finalDiffers ? 'is-differs' : undefined}>{trace.mixed}</span>);
  }
  return <Chain items={items} label={label} />;
}

/** Comparing two fractions: over a common denominator, or (as a rule does it) by the denominators alone. */
export function FractionComparisonDrawing({
  trace,
  differsPlace,
  label,
}: {
  trace: FractionComparisonTrace;
  differsPlace?: string | null;
  label: string;
}) {
  const sign = (
    <span className={`wb-frac-op${differsPlace === 'sign' ? ' is-differs' : ''}`}>
      {trace.sign}
    </span>
  );
  const how =
    trace.basis === 'common-denominator' ? (
      <>
        <FractionFigure fraction={trace.leftScaled} /> {sign}{' '}
        <FractionFigure fraction={trace.rightScaled} />
      </>
    ) : (
      <span className="wb-frac-words">
        compares the bottom numbers only: {trace.left.denominator} and {trace.right.denominator}
      </span>
    );
  return (
    <>
      <Chain
        label={label}
        items={[
          <>
            <FractionFigure fraction={trace.left} /> {sign}{' '}
            <FractionFigure fraction={trace.right} />
          </>,
        ]}
      />
      <p className="wb-trace-aside">
        {trace.basis === 'common-denominator'
          ? `Both over ${trace.commonDenominator}: `
          : 'This way of working '}
        {how}
      </p>
    </>
  );
}

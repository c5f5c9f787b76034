import { Radio, RadioGroup, Tag } from '@blueprintjs/core';
import { CAUSE_GUIDE, CAUSES, type Cause } from '@workback/core';

/**
 * The cause as a choice, one line of guidance each. The checkers' suggestion is marked as
 * such; the parent decides.
 */
export function CausePicker({
  value,
  onChange,
  suggestion,
  disabled,
  name = 'cause',
}: {
  value: Cause;
  onChange: (cause: Cause) => void;
  /** The checkers' (or the interview stage's) suggestion and why. */
  suggestion: { cause: Cause; because: string } | null;
  disabled?: boolean;
  name?: string;
}) {
  return (
    <div className="wb-causes">
      <RadioGroup
        name={name}
        label="Why was it missed?"
        selectedValue={value}
        disabled={disabled}
        onChange={(event) => onChange(event.currentTarget.value as Cause)}
      >
        {CAUSES.map((cause) => (
          <Radio
            key={cause}
            value={cause}
            className="wb-cause"
            size="large"
            labelElement={
              <span className="wb-cause-text">
                <span className="wb-cause-label">
                  {CAUSE_GUIDE[cause].label}
                  {suggestion?.cause === cause ? (
                    <Tag minimal round className="wb-suggested">
                      Suggested
                    </Tag>
                  ) : null}
                </span>
                <span className="wb-cause-hint">{CAUSE_GUIDE[cause].hint}</span>
              </span>
            }
          />
        ))}
      </RadioGroup>
      {suggestion ? (
        <p className="wb-cause-because">
          <strong>Why it is suggested:</strong> {suggestion.because} You know your child: change it
          if it does not fit.
        </p>
      ) : (
        <p className="wb-cause-because">
          Tell a slip from a gap by asking the child to look again: if they find and fix it alone,
          it was a slip.
        </p>
      )}
    </div>
  );
}

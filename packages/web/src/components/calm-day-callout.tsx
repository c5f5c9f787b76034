import { Callout } from '@blueprintjs/core';
import { TimeIcon } from '@blueprintjs/icons';

/** The gentle same-day note: shown when a follow-up is dated on the day of the sitting it reviews. */
export function CalmDayCallout({ what = 'This review' }: { what?: string }) {
  return (
    <Callout icon={<TimeIcon />} className="wb-calm-day" title="Same day as the sitting it reviews">
      {what} is on the same day as the sitting it looks back on. Review usually goes better on a
      calmer, separate day — a common practice, not a rule; it is your call.
    </Callout>
  );
}

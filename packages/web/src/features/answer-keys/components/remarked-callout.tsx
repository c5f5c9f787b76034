import { Callout, Intent } from '@blueprintjs/core';
import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import type { RemarkedSitting } from '../types';

/** After a correction: which sittings were re-marked, their scores before and after. */
export function RemarkedCallout({
  remarked,
  studentName,
  onDismiss,
}: {
  remarked: readonly RemarkedSitting[];
  studentName: (id: number) => string;
  onDismiss: () => void;
}) {
  return (
    <Callout
      intent={Intent.PRIMARY}
      title={`The correction re-marked ${remarked.length} sitting${remarked.length === 1 ? '' : 's'}`}
      className="wb-remarked"
      role="status"
    >
      <ul>
        {remarked.map((sitting) => (
          <li key={sitting.sittingId}>
            <Link to={paths.app.sitting.getHref(sitting.sittingId)}>
              {studentName(sitting.studentId)}’s sitting
            </Link>
            : {sitting.before.correct} → {sitting.after.correct} right of {sitting.after.marked}
            {sitting.resolvedMissIds.length > 0
              ? `; ${sitting.resolvedMissIds.length} miss${sitting.resolvedMissIds.length === 1 ? '' : 'es'} resolved (no longer wrong)`
              : ''}
            {sitting.newMissIds.length > 0
              ? `; ${sitting.newMissIds.length} new miss${sitting.newMissIds.length === 1 ? '' : 'es'} to talk through`
              : ''}
          </li>
        ))}
      </ul>
      <button type="button" className="wb-text-button" onClick={onDismiss}>
        Got it
      </button>
    </Callout>
  );
}

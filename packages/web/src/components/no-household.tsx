import { Callout } from '@blueprintjs/core';
import { ShieldIcon } from '@blueprintjs/icons';

import type { Me } from '../lib/auth';

/** `true` for people who see children's data: members of a household, never the site admin. */
export const seesChildren = (me: Me) => !me.user.isAdmin && me.household !== null;

/** Said instead of a page of children's data to a site admin or someone with no household. */
export function NoHouseholdCallout({ me }: { me: Me }) {
  return (
    <Callout
      icon={<ShieldIcon />}
      title={me.user.isAdmin ? 'Site admins see no children’s data' : 'No household yet'}
      className="wb-callout"
    >
      {me.user.isAdmin
        ? 'You are signed in as the site admin. Households keep their children’s work to themselves.'
        : 'You are not part of a household yet. Ask the family who invited you to send the invitation again.'}
    </Callout>
  );
}

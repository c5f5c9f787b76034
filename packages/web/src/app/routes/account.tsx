import { Card } from '@blueprintjs/core';

import { SignOutButton } from '../../components/layouts/app-shell';
import { roleLabel, useSignedIn } from '../../lib/auth';

const ROLE_EXPLAINED: Record<string, string> = {
  Owner: 'You set up this household and can change everything in it.',
  Parent: 'You can change everything in this household except removing the owner or deleting it.',
  Tutor: 'You can look over the children shared with you. Only the family changes their details.',
  'Site admin': 'You look after the site. You see no children’s data.',
};

export default function AccountRoute() {
  const me = useSignedIn();
  const role = roleLabel(me);
  return (
    <>
      <h1 className="wb-page-title">Account</h1>
      <Card className="wb-account">
        <dl className="wb-facts">
          <dt>Name</dt>
          <dd>{me.user.displayName}</dd>
          <dt>E-mail</dt>
          <dd>{me.user.email}</dd>
          <dt>Household</dt>
          <dd>{me.household?.name ?? 'None'}</dd>
          <dt>Your role</dt>
          <dd>
            {role}
            {ROLE_EXPLAINED[role] ? (
              <span className="wb-muted"> — {ROLE_EXPLAINED[role]}</span>
            ) : null}
          </dd>
        </dl>
        <SignOutButton className="wb-account-signout" />
      </Card>
    </>
  );
}

import { Card } from '@blueprintjs/core';
import { Role } from '@workback/core';
import { Link, useNavigate } from 'react-router-dom';

import { SignOutButton } from '../../components/layouts/app-shell';
import { useToast } from '../../components/toaster';
import { paths } from '../../config/paths';
import { HouseholdData } from '../../features/household-data/components/household-data';
import { canEditHousehold, roleLabel, useMe } from '../../lib/auth';

const ROLE_EXPLAINED: Record<string, string> = {
  Owner: 'You set up this household and can change everything in it.',
  Parent: 'You can change everything in this household except removing the owner or deleting it.',
  Tutor: 'You can look over the children shared with you. Only the family changes their details.',
  'Site admin': 'You look after the site. You see no children’s data.',
};

export default function AccountRoute() {
  const navigate = useNavigate();
  const toast = useToast();
  // Signing out or deleting the household from this page ends the session under it.
  const { data: me } = useMe();
  if (!me) return null;
  const role = roleLabel(me);
  const household = me.household;
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
        {canEditHousehold(me) ? (
          <p>
            <Link to={paths.app.members.getHref()}>Members of this household</Link>: invite a tutor
            or a second parent, and choose what they see.
          </p>
        ) : null}
        {household && household.role !== Role.owner ? (
          <p className="wb-muted">Only the household’s owner can export or delete its data.</p>
        ) : null}
        <SignOutButton className="wb-account-signout" />
      </Card>
      {household?.role === Role.owner ? (
        <HouseholdData
          householdName={household.name}
          onDeleted={(summary) => {
            if (summary.yourAccountClosed) {
              toast(
                `${household.name} is deleted, and so is your account. Thank you for using Workback.`,
              );
              void navigate(paths.signIn.getHref(), { replace: true });
            } else {
              toast(`${household.name} and everything in it is deleted.`);
              void navigate(paths.app.students.getHref(), { replace: true });
            }
          }}
        />
      ) : null}
    </>
  );
}

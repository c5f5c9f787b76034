import { Button, Callout, Classes, Intent } from '@blueprintjs/core';
import { EnvelopeIcon } from '@blueprintjs/icons';
import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';

import { ErrorState, LoadingState } from '../../../components/states';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABEL, useSignOut, type Me } from '../../../lib/auth';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitation } from '../api/get-invitation';
import { ROLE_PROMISE, type InvitationPreview } from '../types';
import { NewAccountForm } from './new-account-form';

import '../invitations.css';

function formatDay(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  return date.toLocaleDateString(undefined, { day: 'numeric', month: 'long', year: 'numeric' });
}

function WhoInvited({ invitation }: { invitation: InvitationPreview }) {
  const who = invitation.invitedByName ?? 'Someone';
  return (
    <div className="wb-invite-summary">
      <p className="wb-invite-lead">
        <EnvelopeIcon aria-hidden /> <strong>{who}</strong> invited{' '}
        <strong>{invitation.email}</strong> to join <strong>{invitation.householdName}</strong> as a{' '}
        {ROLE_LABEL[invitation.role].toLowerCase()}.
      </p>
      <p className="wb-muted">
        {ROLE_PROMISE[invitation.role]} The link works once, until {formatDay(invitation.expiresAt)}
        .
      </p>
    </div>
  );
}

function JoinAsSignedIn({
  token,
  me,
  invitation,
  onJoined,
}: {
  token: string;
  me: Me;
  invitation: InvitationPreview;
  onJoined: (me: Me) => void;
}) {
  const accept = useAcceptInvitation();
  const signOut = useSignOut();
  const [refusal, setRefusal] = useState<string | null>(null);
  const otherAddress = me.user.email.toLowerCase() !== invitation.email.toLowerCase();
  return (
    <div className="wb-invite-choice">
      <p>
        You are signed in as <strong>{me.user.displayName}</strong> ({me.user.email}).
        {otherAddress
          ? ' The invitation went to another address; joining adds this account.'
          : null}
      </p>
      {refusal ? (
        <Callout intent={Intent.WARNING} role="alert" className="wb-form-error" title="Not joined">
          {refusal}
        </Callout>
      ) : null}
      <div className="wb-invite-actions">
        <Button
          intent={Intent.PRIMARY}
          size="large"
          loading={accept.isPending}
          onClick={() => {
            setRefusal(null);
            accept.mutate(
              { token },
              {
                onSuccess: onJoined,
                onError: (error) =>
                  setRefusal(
                    isApiError(error) ? error.message : 'Joining did not work. Please try again.',
                  ),
              },
            );
          }}
        >
          Join {invitation.householdName}
        </Button>
        <Button
          variant="minimal"
          loading={signOut.isPending}
          onClick={() => signOut.mutate(undefined)}
        >
          Not you? Sign out
        </Button>
      </div>
    </div>
  );
}

/**
 * The invitation acceptance page body: who invited you to which household and as what; then
 * "Join" when signed in, or a new account, or signing in first.
 */
export function InvitationView({
  token,
  me,
  caution,
  onJoined,
}: {
  token: string;
  me: Me | null;
  /** The data caution, worded for the role the invitation is for. */
  caution: (role: InvitationPreview['role']) => ReactNode;
  onJoined: (me: Me) => void;
}) {
  const invitation = useInvitation(token);
  if (invitation.isPending) return <LoadingState label="Opening the invitation…" />;
  if (invitation.isError) {
    const gone = isApiError(invitation.error, 404) || isApiError(invitation.error, 410);
    return (
      <div className="wb-invite-problem">
        <ErrorState
          title="This invitation cannot be used."
          error={invitation.error}
          onRetry={gone ? undefined : () => void invitation.refetch()}
        />
        {gone ? (
          <p className="wb-muted">
            Ask the person who invited you to send a new invitation from their Members page.
          </p>
        ) : null}
      </div>
    );
  }
  const preview = invitation.data;
  return (
    <>
      <WhoInvited invitation={preview} />
      {me ? (
        <JoinAsSignedIn token={token} me={me} invitation={preview} onJoined={onJoined} />
      ) : (
        <>
          <section className="wb-invite-choice" aria-labelledby="invite-new">
            <h2 id="invite-new" className="wb-invite-heading">
              New to Workback? Create your account
            </h2>
            <NewAccountForm
              token={token}
              invitedEmail={preview.email}
              householdName={preview.householdName}
              caution={caution(preview.role)}
              onJoined={onJoined}
            />
          </section>
          <section className="wb-invite-choice wb-invite-existing" aria-labelledby="invite-old">
            <h2 id="invite-old" className="wb-invite-heading">
              Already have a Workback account?
            </h2>
            <p className="wb-muted">Sign in first; you come back here to join.</p>
            <Link
              className={`${Classes.BUTTON} ${Classes.OUTLINED} wb-invite-signin`}
              to={paths.signIn.getHref(paths.invitation.getHref(token))}
            >
              <span className={Classes.BUTTON_TEXT}>Sign in, then join</span>
            </Link>
          </section>
        </>
      )}
    </>
  );
}

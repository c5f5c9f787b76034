import { Button, NonIdealState, Spinner } from '@blueprintjs/core';
import { RefreshIcon } from '@blueprintjs/icons';
import type { JSX, ReactNode } from 'react';

import { isApiError } from '../lib/api-client';

/** A quiet spinner with words, so a screen reader hears what is happening. */
export function LoadingState({ label }: { label: string }) {
  return (
    <div className="wb-state" role="status" aria-live="polite">
      <Spinner size={28} aria-hidden />
      <span>{label}</span>
    </div>
  );
}

/** One line that says what to do first, and the action that does it. */
export function EmptyState({
  title,
  action,
  icon,
}: {
  title: string;
  action?: ReactNode;
  icon?: JSX.Element;
}) {
  return (
    <div className="wb-empty">
      <NonIdealState icon={icon} title={title} action={action ? <>{action}</> : undefined} />
    </div>
  );
}

function describe(error: unknown): string {
  if (isApiError(error, 403)) return 'Your role in this household does not allow this.';
  if (isApiError(error, 404))
    return 'This is not here, or it has not been shared with you. If you help a family, ask them to share it from their Members page.';
  if (isApiError(error)) return error.message;
  return 'Something went wrong on this page.';
}

export function ErrorState({
  title,
  error,
  onRetry,
}: {
  title: string;
  error: unknown;
  onRetry?: () => void;
}) {
  return (
    <div className="wb-state wb-state-error" role="alert">
      <p className="wb-state-title">{title}</p>
      <p>{describe(error)}</p>
      {onRetry && !isApiError(error, 404) && !isApiError(error, 403) ? (
        <Button icon={<RefreshIcon />} onClick={onRetry} variant="outlined">
          Try again
        </Button>
      ) : null}
    </div>
  );
}

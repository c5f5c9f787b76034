import { api, isApiError } from '../../lib/api-client';
import { formOf, listDrafts, markRefused, removeDraft } from './drafts-store';

export type SendOutcome = { sent: number; refused: number; waiting: number };

/** Answers that mean "not now" (no connection, server trouble, signed out, throttled): try later. */
const isLater = (status: number) =>
  status === 0 || status >= 500 || status === 401 || status === 408 || status === 429;

let running: Promise<SendOutcome> | null = null;

async function sendAll(householdId: number): Promise<SendOutcome> {
  const outcome: SendOutcome = { sent: 0, refused: 0, waiting: 0 };
  const drafts = (await listDrafts()).filter(
    (d) => d.householdId === householdId && d.refusal === null,
  );
  for (const [i, draft] of drafts.entries()) {
    try {
      await api.upload(draft.path, formOf(draft), {
        headers: { 'Idempotency-Key': draft.key },
      });
      await removeDraft(draft.key);
      outcome.sent += 1;
    } catch (error) {
      if (isApiError(error) && !isLater(error.status)) {
        await markRefused(draft.key, error.message, error.fields);
        outcome.refused += 1;
        continue;
      }
      outcome.waiting = drafts.length - i;
      break;
    }
  }
  return outcome;
}

/**
 * Sends this household's waiting drafts, oldest first, one at a time. One run at a time in this
 * tab, and one across tabs where the browser has Web Locks; a draft that arrives twice anyway
 * answers the same miss, because it carries its Idempotency-Key.
 */
export function sendWaitingDrafts(householdId: number): Promise<SendOutcome> {
  running ??= (
    typeof navigator !== 'undefined' && navigator.locks
      ? navigator.locks.request('workback-drafts', () => sendAll(householdId))
      : sendAll(householdId)
  ).finally(() => {
    running = null;
  });
  return running;
}

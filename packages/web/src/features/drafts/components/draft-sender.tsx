import { useDraftSender } from '../hooks/use-draft-sender';

/** Sends the household's waiting drafts in the background; renders nothing. */
export function DraftSender({ householdId }: { householdId: number }) {
  useDraftSender(householdId);
  return null;
}

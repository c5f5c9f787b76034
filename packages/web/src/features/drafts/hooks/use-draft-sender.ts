import { Intent } from '@blueprintjs/core';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect } from 'react';

import { useToast } from '../../../components/toaster';
import { sendWaitingDrafts } from '../send-drafts';
import { useDrafts } from './use-drafts';

const RETRY_MS = 30_000;

/**
 * Sends the household's waiting drafts when the page opens, when the connection returns, when
 * the page comes back into view, and every half minute while some wait. Mounted once, in the
 * signed-in frame.
 */
export function useDraftSender(householdId: number | null): () => void {
  const queryClient = useQueryClient();
  const toast = useToast();
  const drafts = useDrafts(householdId ?? -1);
  const waiting = drafts.some((d) => d.refusal === null);

  const send = useCallback(() => {
    if (householdId === null || !navigator.onLine) return;
    void sendWaitingDrafts(householdId).then(
      ({ sent, refused }) => {
        if (sent > 0) {
          void queryClient.invalidateQueries({ queryKey: ['misses'] });
          toast(
            sent === 1 ? 'Sent 1 miss that was waiting.' : `Sent ${sent} misses that were waiting.`,
          );
        }
        if (refused > 0) {
          toast('A waiting miss was refused; see the waiting list.', Intent.WARNING);
        }
      },
      () => undefined,
    );
  }, [householdId, queryClient, toast]);

  useEffect(() => {
    const onVisible = () => {
      if (document.visibilityState === 'visible') send();
    };
    window.addEventListener('online', send);
    document.addEventListener('visibilitychange', onVisible);
    return () => {
      window.removeEventListener('online', send);
      document.removeEventListener('visibilitychange', onVisible);
    };
  }, [send]);

  useEffect(() => {
    if (!waiting) return;
    send();
    const timer = window.setInterval(send, RETRY_MS);
    return () => window.clearInterval(timer);
  }, [waiting, send]);

  return send;
}

import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { InvitationPreview } from '../types';

export const invitationLinkKeys = {
  all: ['invitations'] as const,
  preview: (token: string) => [...invitationLinkKeys.all, 'preview', token] as const,
};

export const getInvitation = (token: string) =>
  api.get<InvitationPreview>(`/invitations/${encodeURIComponent(token)}`);

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: invitationLinkKeys.preview(token),
    queryFn: () => getInvitation(token),
    staleTime: 0,
  });

export const useInvitation = (token: string) => useQuery(invitationQueryOptions(token));

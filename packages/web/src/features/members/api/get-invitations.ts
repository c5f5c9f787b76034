import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Invitation } from '../types';

export const invitationKeys = {
  all: ['invitations'] as const,
  lists: () => [...invitationKeys.all, 'list'] as const,
};

export type InvitationList = { items: Invitation[]; total: number };

/** Invitations not yet accepted (pending or expired), newest first. */
export const getInvitations = () => api.get<InvitationList>('/invitations');

export const invitationsQueryOptions = () =>
  queryOptions({ queryKey: invitationKeys.lists(), queryFn: getInvitations });

export const useInvitations = () => useQuery(invitationsQueryOptions());

import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Member } from '../types';

export const memberKeys = {
  all: ['members'] as const,
  lists: () => [...memberKeys.all, 'list'] as const,
};

export type MemberList = { items: Member[]; total: number };

export const getMembers = () => api.get<MemberList>('/members');

export const membersQueryOptions = () =>
  queryOptions({ queryKey: memberKeys.lists(), queryFn: getMembers });

export const useMembers = () => useQuery(membersQueryOptions());

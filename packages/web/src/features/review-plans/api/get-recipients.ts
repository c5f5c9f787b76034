import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Recipient } from '../types';

/** The household's members, the people a plan can be e-mailed to (owners and parents ask). */
export const getRecipients = () => api.get<{ items: Recipient[]; total: number }>('/members');

export const recipientsQueryOptions = () =>
  queryOptions({ queryKey: ['members', 'list'], queryFn: getRecipients });

export const useRecipients = (enabled: boolean) =>
  useQuery({ ...recipientsQueryOptions(), enabled });

import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { OpenMiss } from '../types';

type MissPage = { items: OpenMiss[]; total: number };

/** A student's misses not yet on a plan (logged or discussed), newest first. */
export async function getOpenMisses(studentId: number): Promise<OpenMiss[]> {
  const page = (status: string) =>
    api.get<MissPage>(
      `/misses?studentId=${studentId}&status=${status}&pageSize=100&sort=-occurredOn`,
    );
  const [logged, discussed] = await Promise.all([page('logged'), page('discussed')]);
  return [...logged.items, ...discussed.items].sort(
    (a, b) => b.occurredOn.localeCompare(a.occurredOn) || b.id - a.id,
  );
}

export const openMissesQueryOptions = (studentId: number) =>
  queryOptions({
    queryKey: ['misses', 'list', { studentId, open: true }],
    queryFn: () => getOpenMisses(studentId),
  });

export const useOpenMisses = (studentId: number) => useQuery(openMissesQueryOptions(studentId));

import {
  CAUSES,
  INTERVIEW_STAGES,
  MISS_KINDS,
  MISS_STATUSES,
  type Cause,
  type InterviewStage,
  type MissKind,
  type MissStatus,
} from '@workback/core';
import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';

import { DEFAULT_SORT, PAGE_SIZE, type MissFilters } from '../types';

export const SORTS = [
  { value: '-occurredOn', label: 'Newest first' },
  { value: 'occurredOn', label: 'Oldest first' },
  { value: '-updatedAt', label: 'Recently changed' },
  { value: 'problem', label: 'Problem, A to Z' },
  { value: 'cause', label: 'Cause' },
  { value: 'status', label: 'Status' },
] as const;

/** The filters that live in the address bar, by their names there. */
export type FilterParams = {
  student: string;
  cause: string;
  status: string;
  kind: string;
  stage: string;
  rule: string;
  skill: string;
  from: string;
  to: string;
  q: string;
  sort: string;
  page: string;
};

const FILTER_NAMES = [
  'student',
  'cause',
  'status',
  'kind',
  'stage',
  'rule',
  'skill',
  'from',
  'to',
  'q',
] as const;
const DAY = /^\d{4}-\d{2}-\d{2}$/;

/**
 * `?student=2&cause=step&page=2` → the server query `{ studentId: 2, cause: 'step', page: 2, … }`;
 * values the server would refuse are dropped rather than sent.
 */
export function filtersFromParams(params: URLSearchParams): MissFilters {
  const text = (name: string) => params.get(name)?.trim() || undefined;
  const student = Number(params.get('student'));
  const page = Number(params.get('page'));
  const cause = text('cause');
  const status = text('status');
  const kind = text('kind');
  const stage = text('stage');
  const sort = text('sort');
  const from = text('from');
  const to = text('to');
  return {
    studentId: Number.isInteger(student) && student > 0 ? student : undefined,
    cause: cause && (CAUSES as readonly string[]).includes(cause) ? (cause as Cause) : undefined,
    status:
      status && (MISS_STATUSES as readonly string[]).includes(status)
        ? (status as MissStatus)
        : undefined,
    kind: kind && (MISS_KINDS as readonly string[]).includes(kind) ? (kind as MissKind) : undefined,
    stage:
      stage && (INTERVIEW_STAGES as readonly string[]).includes(stage)
        ? (stage as InterviewStage)
        : undefined,
    rule: text('rule'),
    skill: text('skill'),
    from: from && DAY.test(from) ? from : undefined,
    to: to && DAY.test(to) ? to : undefined,
    q: text('q'),
    sort: sort && SORTS.some((s) => s.value === sort) ? sort : DEFAULT_SORT,
    page: Number.isInteger(page) && page > 0 ? page : 1,
    pageSize: PAGE_SIZE,
  };
}

/** How many filters narrow the list (sorting and paging do not count). */
export function activeFilterCount(params: URLSearchParams): number {
  return FILTER_NAMES.filter((name) => params.get(name)?.trim()).length;
}

/** The notebook's filters, read from and written to the URL so a view can be shared. */
export function useNotebookFilters() {
  const [params, setParams] = useSearchParams();
  const filters = useMemo(() => filtersFromParams(params), [params]);
  const value = (name: keyof FilterParams) => params.get(name) ?? '';

  const set = useCallback(
    (changes: Partial<FilterParams>) => {
      setParams(
        (current) => {
          const next = new URLSearchParams(current);
          for (const [name, v] of Object.entries(changes)) {
            if (v === undefined || v === '') next.delete(name);
            else next.set(name, v);
          }
          // A new filter or order starts again from the first page.
          if (!('page' in changes)) next.delete('page');
          if (next.get('sort') === DEFAULT_SORT) next.delete('sort');
          return next;
        },
        { replace: true },
      );
    },
    [setParams],
  );

  const clear = useCallback(() => setParams(new URLSearchParams(), { replace: true }), [setParams]);

  return { filters, value, set, clear, active: activeFilterCount(params) };
}

import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Note } from '../types';

export const noteKeys = {
  all: ['notes'] as const,
  lists: () => [...noteKeys.all, 'list'] as const,
  forMiss: (missId: number) => [...noteKeys.lists(), { missId }] as const,
};

export type NoteList = { items: Note[]; total: number; page: number; pageSize: number };

/** One miss's thread, oldest first. */
export const getNotes = (missId: number) =>
  api.get<NoteList>(`/notes?missId=${missId}&pageSize=100`);

export const notesQueryOptions = (missId: number) =>
  queryOptions({ queryKey: noteKeys.forMiss(missId), queryFn: () => getNotes(missId) });

export const useNotes = (missId: number) => useQuery(notesQueryOptions(missId));

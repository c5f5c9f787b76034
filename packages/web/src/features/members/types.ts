import type { Role } from '@workback/core';

export type Member = {
  id: number;
  userId: number;
  displayName: string;
  email: string;
  role: Role;
  /** A tutor's students; `null` for owners and parents, who see every student. */
  studentIds: number[] | null;
  joinedAt: string;
  isYou: boolean;
};

export type InvitationStatus = 'pending' | 'expired' | 'accepted';

export type Invitation = {
  id: number;
  email: string;
  role: Role;
  studentIds: number[];
  invitedBy: { id: number; displayName: string } | null;
  status: InvitationStatus;
  expiresAt: string;
  createdAt: string;
};

export type InvitationInput = { email: string; role: Role; studentIds: number[] };

export type MemberChanges = { role?: Role; studentIds?: number[] };

/** The household's children as this page needs them (the route passes them in). */
export type StudentRef = { id: number; name: string };

/** `studentNames([2, 1], students)` → `'Juniper and Ollie'` (in the household's order). */
export function studentNames(ids: readonly number[], students: readonly StudentRef[]): string {
  const wanted = new Set(ids);
  const names = students.filter((s) => wanted.has(s.id)).map((s) => s.name);
  const missing = ids.length - names.length;
  if (missing > 0)
    names.push(missing === 1 ? 'one removed student' : `${missing} removed students`);
  if (names.length <= 1) return names[0] ?? 'nobody yet';
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** `formatDay('2026-03-04T10:00:00Z')` → `'4 Mar 2026'` (in the reader's locale). */
export function formatDay(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  return date.toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' });
}

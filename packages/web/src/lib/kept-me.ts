import type { Me } from './auth';

/**
 * What this phone keeps of the signed-in person so the app still opens with no connection: the
 * last answer of /api/auth/me (the parent's own account and household, no children's data) and,
 * for the log form, the children's ids and first names only. Nothing else of a child is kept:
 * no misses, no photos, no grades. Replaced at each answer, removed on sign-out and whenever the
 * server says nobody is signed in.
 */
type Kept = {
  me: Me;
  students: { householdId: number; list: KeptStudent[] } | null;
};

export type KeptStudent = { id: number; name: string };

const KEY = 'workback.kept-me';

function read(): Kept | null {
  try {
    const text = localStorage.getItem(KEY);
    if (!text) return null;
    const kept = JSON.parse(text) as Kept;
    return kept && typeof kept === 'object' && kept.me?.user ? kept : null;
  } catch {
    return null;
  }
}

function write(kept: Kept): void {
  try {
    localStorage.setItem(KEY, JSON.stringify(kept));
  } catch {
    // Storage full or refused (private browsing): the app works, only not offline.
  }
}

/** Keeps the answer of /api/auth/me; the children's names stay only for the same household. */
export function keepMe(me: Me): void {
  const before = read();
  const sameHousehold =
    before?.me.user.id === me.user.id && before.students?.householdId === me.household?.id;
  const { offline: _offline, ...answer } = me;
  write({ me: answer, students: sameHousehold ? before.students : null });
}

/** The person last signed in on this phone, or null. */
export function keptMe(): Me | null {
  return read()?.me ?? null;
}

/** Keeps the ids and names of the household's children (for the log form with no connection). */
export function keepStudents(list: readonly { id: number; name: string }[]): void {
  const before = read();
  const household = before?.me.household;
  // Only where the form that needs them is used: owners and parents log misses, tutors do not.
  if (!before || !household || household.role === 'tutor') return;
  const householdId = household.id;
  write({
    ...before,
    students: { householdId, list: list.map(({ id, name }) => ({ id, name })) },
  });
}

/** The children kept for this household, or null when none were kept. */
export function keptStudents(householdId: number): KeptStudent[] | null {
  const students = read()?.students;
  return students && students.householdId === householdId ? students.list : null;
}

/** Forgets everything kept: on sign-out, and when the server says the session has ended. */
export function forgetKept(): void {
  try {
    localStorage.removeItem(KEY);
  } catch {
    // Nothing was kept.
  }
}

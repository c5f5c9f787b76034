import { EDITOR_ROLES, type Role } from '@workback/core';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { api, forgetCsrfToken, isApiError } from './api-client';
import { forgetKept, keepMe, keptMe } from './kept-me';

export type HouseholdSummary = { id: number; name: string; role: Role };

export type Me = {
  user: {
    id: number;
    email: string;
    displayName: string;
    isAdmin: boolean;
    /** false until the address is confirmed by the mailed link (inviting waits for it). */
    emailVerified?: boolean;
  };
  household: HouseholdSummary | null;
  households: HouseholdSummary[];
  /**
   * Set when the server could not be reached and this is the answer kept on this phone from the
   * last time (see kept-me.ts): the app opens in its offline state.
   */
  offline?: true;
};

export type SignInInput = { email: string; password: string };

export type CreateAccountInput = {
  householdName: string;
  displayName: string;
  email: string;
  password: string;
  adultConfirmed: true;
};

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

/**
 * The signed-in person, or `null` when nobody is signed in (the API answers 401). With no
 * connection, the person last signed in on this phone, marked `offline`.
 */
export async function getMe(): Promise<Me | null> {
  try {
    const me = await api.get<Me>('/auth/me');
    keepMe(me);
    return me;
  } catch (error) {
    if (isApiError(error, 401)) {
      forgetKept();
      return null;
    }
    const kept = isApiError(error, 0) ? keptMe() : null;
    if (kept) return { ...kept, offline: true };
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: getMe,
    // The kept answer is asked again as soon as anything refetches.
    staleTime: (query) => (query.state.data?.offline ? 0 : 60_000),
  });

export const useMe = () => useQuery(meQueryOptions());

/** For screens inside the signed-in shell, whose loader has already made sure of a session. */
export function useSignedIn(): Me {
  const { data } = useMe();
  if (!data) throw new Error('useSignedIn is only for pages behind the sign-in check');
  return data;
}

/** Owners and parents change household data; tutors read; site admins see no children's data. */
export function canEditHousehold(me: Me): boolean {
  return !me.user.isAdmin && !!me.household && EDITOR_ROLES.includes(me.household.role);
}

export async function signIn(input: SignInInput): Promise<Me> {
  const me = await api.post<Me>('/auth/login', input);
  forgetCsrfToken();
  keepMe(me);
  return me;
}

export async function createAccount(input: CreateAccountInput): Promise<Me> {
  const me = await api.post<Me>('/auth/register', input);
  forgetCsrfToken();
  keepMe(me);
  return me;
}

export async function signOut(): Promise<void> {
  // Forgotten first: even when the server cannot be told, this phone keeps nothing of the person.
  forgetKept();
  try {
    await api.post<void>('/auth/logout');
  } finally {
    forgetCsrfToken();
  }
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}

export function useCreateAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAccount,
    onSuccess: (me) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      // Nothing of this household may linger in memory for the next person at this browser.
      queryClient.clear();
      queryClient.setQueryData(authKeys.me(), null);
    },
  });
}

/** `ROLE_LABEL.tutor` → `'Tutor'`. */
export const ROLE_LABEL: Readonly<Record<Role, string>> = {
  owner: 'Owner',
  parent: 'Parent',
  tutor: 'Tutor',
};

/** `'Owner'`, `'Parent'`, `'Tutor'` or `'Site admin'`. */
export function roleLabel(me: Me): string {
  if (me.household) return ROLE_LABEL[me.household.role];
  return me.user.isAdmin ? 'Site admin' : 'No household';
}

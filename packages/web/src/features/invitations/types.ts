import type { Role } from '@workback/core';

/** What an invitation link is for, shown before the person decides. */
export type InvitationPreview = {
  email: string;
  role: Role;
  householdName: string;
  invitedByName: string | null;
  expiresAt: string;
};

/** Signed in: nothing. A new person: their name and password (the e-mail defaults to the invited one). */
export type AcceptInput = { displayName?: string; password?: string; email?: string };

export const ROLE_PROMISE: Readonly<Record<Role, string>> = {
  owner: 'An owner can change everything in the household.',
  parent: 'As a parent you will see and change everything in the household.',
  tutor:
    'As a tutor you will see the work of the children they chose for you, add notes and build review plans. Only the family changes their details.',
};

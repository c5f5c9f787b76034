import type { Role } from '@workback/core';

export interface SessionUser {
  id: number;
  email: string;
  displayName: string;
  /** The owner opened the link mailed to the address (needed to invite, and for admin rights). */
  emailVerified: boolean;
  isAdmin: boolean;
}

/**
 * Who is asking, in which household, and which students they may see.
 * Every service query is scoped through this; `studentIds` is null for
 * owners and parents (all students) and the granted list for a tutor.
 */
export interface MemberContext {
  userId: number;
  membershipId: number;
  householdId: number;
  role: Role;
  studentIds: readonly number[] | null;
}

export function canSeeStudent(member: MemberContext, studentId: number): boolean {
  return member.studentIds === null || member.studentIds.includes(studentId);
}

declare module 'express-serve-static-core' {
  interface Request {
    member?: MemberContext;
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
    householdId?: number;
    signedInAt?: number;
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

import { Injectable, type OnModuleDestroy } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Role } from '@workback/core';
import type { ModelStatic, Model } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { Student } from '../students/models/student.model.js';
import { User } from '../users/models/user.model.js';
import type { SessionUser } from '../common/member-context.js';
import { watchWrites } from '../database/model-writes.js';
import { Household } from './models/household.model.js';
import { Membership } from './models/membership.model.js';
import { StudentGrant } from './models/student-grant.model.js';

/** One membership of a user, with a tutor's granted students (null for owners and parents). */
export interface CachedMembership {
  id: number;
  householdId: number;
  role: Role;
  studentIds: readonly number[] | null;
}

interface Entry<T> {
  generation: number;
  at: number;
  value: Promise<T>;
}

/** Writes to these models can change who someone is or what they may see. */
const WATCHED: ModelStatic<Model>[] = [User, Household, Membership, StudentGrant, Student];

/**
 * A short-lived cache of the session user and their memberships, so a signed-in request does
 * not read `users`, `memberships` and `student_grants` every time. Any write through the models
 * above empties it (again once its transaction commits), and services that change those tables
 * in raw SQL call `clear()` themselves; entries also expire after `ttlMs`, a minute: long enough
 * that a parent's visit reads them once (at 5 s, most requests of many families read both
 * tables again), short enough that an edit made past the app (a restored file) soon shows.
 *
 * On PostgreSQL (DATABASE_URL) nothing is kept: several processes share the database, and a
 * grant removed through one must hold on the others at their very next request, which no
 * per-process copy can promise (a notice from the other process could still be on its way).
 */
@Injectable()
export class MemberCache implements OnModuleDestroy {
  static readonly TTL_MS = 60_000;
  private readonly ttlMs = MemberCache.TTL_MS;
  private generation = 0;
  private readonly users = new Map<number, Entry<SessionUser | null>>();
  private readonly memberships = new Map<number, Entry<readonly CachedMembership[]>>();
  private readonly shared: boolean;
  private readonly unwatch: () => void;

  // The connection is injected so the models are registered with it before hooks are added.
  constructor(@InjectConnection() sequelize: Sequelize) {
    this.shared = sequelize.getDialect() === 'postgres';
    this.unwatch = watchWrites(WATCHED, () => this.clear());
  }

  user(id: number, load: () => Promise<SessionUser | null>): Promise<SessionUser | null> {
    return this.get(this.users, id, load).then((u) => (u ? { ...u } : null));
  }

  membershipsOf(
    userId: number,
    load: () => Promise<readonly CachedMembership[]>,
  ): Promise<readonly CachedMembership[]> {
    return this.get(this.memberships, userId, load);
  }

  /** Forgets everything: the next request of every member reads the tables again. */
  clear(): void {
    this.generation += 1;
    this.users.clear();
    this.memberships.clear();
  }

  onModuleDestroy(): void {
    this.unwatch();
  }

  private get<T>(map: Map<number, Entry<T>>, key: number, load: () => Promise<T>): Promise<T> {
    if (this.shared) return load();
    const now = Date.now();
    const hit = map.get(key);
    if (hit && hit.generation === this.generation && now - hit.at < this.ttlMs) return hit.value;
    const generation = this.generation;
    const value = load();
    // Requests arriving while it loads share the one read; a failed read is not kept.
    map.set(key, { generation, at: now, value });
    value.catch(() => {
      if (map.get(key)?.value === value) map.delete(key);
    });
    if (map.size > 10_000) {
      for (const [k, e] of map) if (now - e.at >= this.ttlMs) map.delete(k);
    }
    return value;
  }
}

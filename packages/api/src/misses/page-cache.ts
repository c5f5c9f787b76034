import { Injectable, type OnModuleDestroy } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Model } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { watchWrites } from '../database/model-writes.js';
import { Photo } from '../photos/models/photo.model.js';
import { Student } from '../students/models/student.model.js';
import { MissRule } from './models/miss-rule.model.js';
import { Miss } from './models/miss.model.js';

interface Entry<T> {
  at: number;
  value: Promise<T>;
  /** The misses on the page, once read: a photo written to one of them outdates the page. */
  missIds?: ReadonlySet<number>;
}

/**
 * Notebook pages as last read, per household and filter, so paging back and forth and the
 * list a parent returns to cost no query until something on them changes. Every write through
 * the models a page is made of (its misses, their photos and rule rows, the household's
 * students) forgets the household's pages, or just the pages showing that miss, at once and
 * again when the write's transaction commits; anything written past the models shows within
 * `TTL_MS`. A read that started before a write is never kept after it.
 *
 * SQLite only: with several processes on one PostgreSQL a page written by another process
 * would not be heard of here, and the database serves such reads well enough itself.
 */
@Injectable()
export class PageCache implements OnModuleDestroy {
  static readonly TTL_MS = 10_000;
  /** About 50 kB each in memory: a bound of 10 MB or so. */
  static readonly MAX_PAGES = 200;
  private readonly households = new Map<number, Map<string, Entry<unknown>>>();
  private size = 0;
  private readonly enabled: boolean;
  private readonly unwatch: () => void;

  // The connection is injected so the models are registered with it before hooks are added.
  constructor(@InjectConnection() sequelize: Sequelize) {
    this.enabled = sequelize.getDialect() === 'sqlite';
    this.unwatch = watchWrites([Miss, MissRule, Student, Photo], (rows) => this.written(rows));
  }

  /** The page under `key` for this household, read with `load` when not kept or outdated. */
  page<T extends { items: readonly { id: number }[] }>(
    householdId: number,
    key: string,
    load: () => Promise<T>,
  ): Promise<T> {
    if (!this.enabled) return load();
    const now = Date.now();
    let pages = this.households.get(householdId);
    const hit = pages?.get(key);
    if (hit && now - hit.at < PageCache.TTL_MS) return hit.value as Promise<T>;
    if (this.size >= PageCache.MAX_PAGES) this.forgetAll();
    if (!pages) this.households.set(householdId, (pages = new Map()));
    if (hit) this.size--;
    const value = load();
    const entry: Entry<T> = { at: now, value };
    pages.set(key, entry);
    this.size++;
    value.then(
      (page) => (entry.missIds = new Set(page.items.map((item) => item.id))),
      () => this.forget(householdId, key, entry),
    );
    return value;
  }

  onModuleDestroy(): void {
    this.unwatch();
  }

  private written(rows: readonly Model[]): void {
    // A bulk update or destroy names no rows: it may have touched any household.
    if (rows.length === 0) return this.forgetAll();
    for (const row of rows) {
      if (row instanceof Photo) this.forgetPagesShowing(row.missId);
      else this.forgetHousehold((row as Miss | MissRule | Student).householdId);
    }
  }

  private forget(householdId: number, key: string, entry: Entry<unknown>): void {
    const pages = this.households.get(householdId);
    if (pages?.get(key) !== entry) return;
    pages.delete(key);
    this.size--;
  }

  private forgetHousehold(householdId: number): void {
    const pages = this.households.get(householdId);
    if (!pages) return;
    this.size -= pages.size;
    this.households.delete(householdId);
  }

  private forgetPagesShowing(missId: number): void {
    for (const [householdId, pages] of this.households) {
      for (const [key, entry] of pages) {
        // A page still being read may be about to show it.
        if (!entry.missIds || entry.missIds.has(missId)) this.forget(householdId, key, entry);
      }
    }
  }

  private forgetAll(): void {
    this.households.clear();
    this.size = 0;
  }
}

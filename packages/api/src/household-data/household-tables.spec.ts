import { describe, expect, it } from 'vitest';
import { deletionOrder, householdTables, type TableInfo } from './household-tables.js';

const fk = (column: string, table: string, notNull = true) => ({
  column,
  table,
  to: 'id',
  notNull,
});
const table = (name: string, ...foreignKeys: TableInfo['foreignKeys']): TableInfo => ({
  name,
  columns: ['id', ...foreignKeys.map((k) => k.column)],
  foreignKeys,
});

// A hand-made schema shaped like Workback's (migrations 0001–0004).
const SCHEMA: TableInfo[] = [
  table('users'),
  table('households'),
  table('schema_migrations'),
  table('memberships', fk('household_id', 'households'), fk('user_id', 'users')),
  table('students', fk('household_id', 'households')),
  table('student_grants', fk('membership_id', 'memberships'), fk('student_id', 'students')),
  table('courses', fk('household_id', 'households')),
  table('lessons', fk('course_id', 'courses')),
  table('answer_keys', fk('household_id', 'households'), fk('course_id', 'courses', false)),
  table('key_items', fk('answer_key_id', 'answer_keys'), fk('parent_id', 'key_items', false)),
  table('password_reset_tokens', fk('user_id', 'users')),
  table('orphan_notes', fk('student_id', 'students', false)),
];

describe('householdTables', () => {
  const tables = new Map(householdTables(SCHEMA).map((t) => [t.name, t]));

  it('takes every table with a foreign-key path to households, and nothing that only points at users', () => {
    expect([...tables.keys()].sort()).toEqual(
      [
        'answer_keys',
        'courses',
        'households',
        'key_items',
        'lessons',
        'memberships',
        'orphan_notes',
        'student_grants',
        'students',
      ].sort(),
    );
  });

  it('prefers a direct, NOT NULL household key over a longer or nullable path', () => {
    expect(tables.get('answer_keys')!.where).toBe(
      '"household_id" IN (SELECT "id" FROM "households" WHERE id = ?)',
    );
    expect(tables.get('lessons')!.where).toBe(
      '"course_id" IN (SELECT "id" FROM "courses" WHERE "household_id" IN (SELECT "id" FROM "households" WHERE id = ?))',
    );
    expect(tables.get('households')!.where).toBe('id = ?');
  });

  it('orders deletion children first, so RESTRICT keys never trip', () => {
    const order = deletionOrder([...tables.values()]).map((t) => t.name);
    const before = (child: string, parent: string) =>
      expect(order.indexOf(child), `${child} before ${parent}`).toBeLessThan(order.indexOf(parent));
    before('lessons', 'courses');
    before('answer_keys', 'courses');
    before('key_items', 'answer_keys');
    before('student_grants', 'memberships');
    before('student_grants', 'students');
    before('orphan_notes', 'students');
    expect(order.at(-1)).toBe('households');
    expect(order).toHaveLength(tables.size);
  });
});

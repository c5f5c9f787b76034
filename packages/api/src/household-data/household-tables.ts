import { addToList } from '../common/add-to-list.js';

/**
 * Which tables hold a household's rows, read from the database's own foreign
 * keys: `households` itself, then every table with a foreign-key path to it
 * (students → households, lessons → courses → households, …). Tables added
 * later by any module are included as soon as their migration declares its
 * foreign keys; tables that only point at `users` (password-reset tokens) are
 * not household data.
 */
export interface ForeignKey {
  column: string;
  table: string;
  to: string;
  notNull: boolean;
}

export interface TableInfo {
  name: string;
  columns: string[];
  foreignKeys: ForeignKey[];
}

export interface HouseholdTable {
  name: string;
  columns: string[];
  /** SQL condition selecting this household's rows; one `?` for the household id. */
  where: string;
  /** Tables this one points at that are household tables too (delete this one first). */
  parents: string[];
}

const q = (name: string) => `"${name.replace(/"/g, '""')}"`;

export function householdTables(tables: readonly TableInfo[]): HouseholdTable[] {
  const byName = new Map(tables.map((t) => [t.name, t]));
  const where = new Map<string, { sql: string; depth: number; notNull: boolean }>();
  if (byName.has('households')) where.set('households', { sql: 'id = ?', depth: 0, notNull: true });
  // Relax until nothing changes: each table takes its shortest, preferably NOT NULL, path.
  for (let changed = true; changed;) {
    changed = false;
    for (const t of tables) {
      if (t.name === 'households') continue;
      for (const fk of t.foreignKeys) {
        const parent = where.get(fk.table);
        if (!parent || fk.table === t.name) continue;
        const candidate = {
          sql: `${q(fk.column)} IN (SELECT ${q(fk.to)} FROM ${q(fk.table)} WHERE ${parent.sql})`,
          depth: parent.depth + 1,
          notNull: fk.notNull && parent.notNull,
        };
        const current = where.get(t.name);
        if (
          !current ||
          (candidate.notNull && !current.notNull) ||
          (candidate.notNull === current.notNull && candidate.depth < current.depth)
        ) {
          where.set(t.name, candidate);
          changed = true;
        }
      }
    }
  }
  return [...where.entries()].map(([name, w]) => {
    const info = byName.get(name)!;
    return {
      name,
      columns: info.columns,
      where: w.sql,
      parents: [
        ...new Set(
          info.foreignKeys.map((fk) => fk.table).filter((p) => p !== name && where.has(p)),
        ),
      ],
    };
  });
}

/** Children before parents, so deleting in this order never trips a RESTRICT key. */
export function deletionOrder(tables: readonly HouseholdTable[]): HouseholdTable[] {
  const byName = new Map(tables.map((t) => [t.name, t]));
  const children = new Map<string, string[]>();
  for (const t of tables) {
    for (const p of t.parents) addToList(children, p, t.name);
  }
  const order: HouseholdTable[] = [];
  const done = new Set<string>();
  const visiting = new Set<string>();
  const visit = (name: string) => {
    if (done.has(name) || visiting.has(name)) return;
    visiting.add(name);
    for (const child of children.get(name) ?? []) visit(child);
    visiting.delete(name);
    done.add(name);
    order.push(byName.get(name)!);
  };
  for (const t of [...tables].sort((a, b) => a.name.localeCompare(b.name))) visit(t.name);
  return order;
}

export { q as quoteIdentifier };

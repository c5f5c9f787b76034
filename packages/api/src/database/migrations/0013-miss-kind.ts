import { missKindOf } from '@workback/core';
import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

export const name = '0013-miss-kind';

/**
 * The notebook's kind of each miss (`missKindOf`: whole, fraction, decimal, money, time, word,
 * other), kept on the row so the kind filter and the kind the notebook shows are one value.
 * Filled for the misses already there, a few hundred rows per statement.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('misses', 'kind', {
    type: DataTypes.STRING(16),
    allowNull: false,
    defaultValue: 'other',
  });
  const rows = await qi.sequelize.query<{
    id: number;
    problem: string;
    lines: string | null;
    stage: string | null;
  }>('SELECT id, problem, lines, stage FROM misses', { type: QueryTypes.SELECT });
  const byKind = new Map<string, number[]>();
  for (const r of rows) {
    const lines = r.lines === null ? null : (JSON.parse(r.lines) as string[] | null);
    const kind = missKindOf(r.problem, { lines, stage: r.stage });
    const ids = byKind.get(kind) ?? [];
    ids.push(r.id);
    byKind.set(kind, ids);
  }
  for (const [kind, ids] of byKind) {
    for (let i = 0; i < ids.length; i += 500) {
      await qi.sequelize.query('UPDATE misses SET kind = :kind WHERE id IN (:ids)', {
        replacements: { kind, ids: ids.slice(i, i + 500) },
      });
    }
  }
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('misses', 'kind');
}

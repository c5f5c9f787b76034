import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0012-word-problem-lines';

/**
 * A word problem's number sentences on the miss: `lines` (the child's sentences, JSON text),
 * `lines_check` (what checkLines made of them when saved, JSON text, kept beside the rule ids
 * it fed so the two never disagree after an engine update) and `stage`, the interview stage
 * where the parent found it went wrong (Newman 1977).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('misses', 'lines', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('misses', 'lines_check', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('misses', 'stage', { type: DataTypes.STRING(16), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('misses', 'stage');
  await qi.removeColumn('misses', 'lines_check');
  await qi.removeColumn('misses', 'lines');
}

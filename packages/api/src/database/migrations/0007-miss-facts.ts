import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0007-miss-facts';

/**
 * The basic facts a miss's diagnosis found wrong, beside `rule_ids`: with both on the row,
 * patterns read no diagnosis JSON (a few KB a miss). Filled from the stored diagnoses.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('misses', 'facts', {
    type: DataTypes.TEXT,
    allowNull: false,
    defaultValue: '[]',
  });
  const facts =
    qi.sequelize.getDialect() === 'postgres'
      ? `(d.diagnosis::jsonb -> 'facts')::text`
      : `json_extract(d.diagnosis, '$.facts')`;
  await qi.sequelize.query(
    `UPDATE misses SET facts = COALESCE(
       (SELECT ${facts} FROM miss_diagnoses d WHERE d.miss_id = misses.id),
       '[]')`,
  );
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('misses', 'facts');
}

import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0011-check-ups';

/**
 * A check-up: a few problems chosen to tell a child's possible explanations apart. Its sheet
 * is kept as an answer key of kind `check-up` (so taking it is a sitting like any other, and
 * counts in patterns and the time-of-day summary); this row keeps the hypotheses, the answer
 * each would write, and, once taken, the sitting and what the answers said.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('check_ups', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'households', key: 'id' },
      onDelete: 'CASCADE',
    },
    student_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'students', key: 'id' },
      onDelete: 'CASCADE',
    },
    answer_key_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'answer_keys', key: 'id' },
      onDelete: 'CASCADE',
    },
    sitting_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'sittings', key: 'id' },
      onDelete: 'SET NULL',
    },
    rule_ids: { type: DataTypes.TEXT, allowNull: false },
    sheet: { type: DataTypes.TEXT, allowNull: false },
    reading: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('check_ups', ['household_id', 'student_id'], {
    name: 'check_ups_household_student',
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('check_ups');
}

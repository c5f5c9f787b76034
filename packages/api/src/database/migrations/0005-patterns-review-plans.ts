import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

const ref = (model: string, onDelete: 'CASCADE' | 'SET NULL', allowNull = false) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model, key: 'id' },
  onDelete,
});

export const name = '0005-patterns-review-plans';

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('review_plans', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: ref('households', 'CASCADE'),
    student_id: ref('students', 'CASCADE'),
    scheduled_for: { type: DataTypes.DATEONLY, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    // The pattern keys the plan's misses showed when it was made (for fading).
    covers: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
    lessons_text: { type: DataTypes.STRING(400), allowNull: false, defaultValue: '' },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
    created_by: ref('users', 'SET NULL', true),
    ...timestamps,
  });
  await qi.addIndex('review_plans', ['household_id', 'student_id', 'scheduled_for']);

  await qi.createTable('review_plan_items', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    plan_id: ref('review_plans', 'CASCADE'),
    position: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    key: { type: DataTypes.STRING(120), allowNull: false },
    title: { type: DataTypes.STRING(300), allowNull: false },
    payload: { type: DataTypes.TEXT, allowNull: false },
    done: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    done_at: { type: DataTypes.DATE, allowNull: true },
    done_by: ref('users', 'SET NULL', true),
    ...timestamps,
  });
  await qi.addIndex('review_plan_items', ['plan_id', 'position'], { unique: true });

  await qi.createTable('review_plan_item_misses', {
    item_id: { ...ref('review_plan_items', 'CASCADE'), primaryKey: true },
    miss_id: { ...ref('misses', 'CASCADE'), primaryKey: true },
  });
  await qi.addIndex('review_plan_item_misses', ['miss_id']);

  await qi.createTable('pattern_notes', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: ref('households', 'CASCADE'),
    student_id: ref('students', 'CASCADE'),
    pattern_key: { type: DataTypes.STRING(120), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    author_id: ref('users', 'SET NULL', true),
    ...timestamps,
  });
  await qi.addIndex('pattern_notes', ['household_id', 'student_id', 'pattern_key']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('pattern_notes');
  await qi.dropTable('review_plan_item_misses');
  await qi.dropTable('review_plan_items');
  await qi.dropTable('review_plans');
}

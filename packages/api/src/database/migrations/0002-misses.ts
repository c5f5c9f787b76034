import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0002-misses';

const byUser = {
  type: DataTypes.INTEGER,
  allowNull: true,
  references: { model: 'users', key: 'id' },
  onDelete: 'SET NULL',
};

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('misses', {
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
    occurred_on: { type: DataTypes.DATEONLY, allowNull: false },
    // Links to the keys issue's sittings and answer-key items; their tables (and FKs) come in 0003.
    sitting_id: { type: DataTypes.INTEGER, allowNull: true },
    key_item_id: { type: DataTypes.INTEGER, allowNull: true },
    problem: { type: DataTypes.STRING(200), allowNull: false },
    answer: { type: DataTypes.STRING(80), allowNull: false },
    steps: { type: DataTypes.TEXT, allowNull: true },
    explanation: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    cause: { type: DataTypes.STRING(16), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    status: { type: DataTypes.STRING(16), allowNull: false },
    skills: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
    revisit: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
    engine_version: { type: DataTypes.STRING(40), allowNull: true },
    not_checked_reason: { type: DataTypes.STRING(300), allowNull: true },
    expected: { type: DataTypes.STRING(80), allowNull: true },
    correct: { type: DataTypes.BOOLEAN, allowNull: true },
    rule_ids: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
    suggested_cause: { type: DataTypes.STRING(16), allowNull: true },
    created_by: byUser,
    updated_by: byUser,
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('misses', ['household_id', 'student_id', 'occurred_on', 'id']);
  await qi.addIndex('misses', ['household_id', 'occurred_on', 'id']);
  await qi.addIndex('misses', ['household_id', 'created_at', 'id']);
  await qi.addIndex('misses', ['household_id', 'status', 'occurred_on']);
  await qi.addIndex('misses', ['household_id', 'cause', 'occurred_on']);
  await qi.addIndex('misses', ['student_id']);
  await qi.addIndex('misses', ['sitting_id']);
  await qi.addIndex('misses', ['key_item_id']);

  // The engine's diagnosis JSON (a few kB) lives apart, so list scans read small rows.
  await qi.createTable('miss_diagnoses', {
    miss_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      primaryKey: true,
      references: { model: 'misses', key: 'id' },
      onDelete: 'CASCADE',
    },
    diagnosis: { type: DataTypes.TEXT, allowNull: false },
  });

  // One row per rule id a miss's diagnosis names, so `rule=` filters use an index.
  await qi.createTable('miss_rules', {
    miss_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      primaryKey: true,
      references: { model: 'misses', key: 'id' },
      onDelete: 'CASCADE',
    },
    rule_id: { type: DataTypes.STRING(80), allowNull: false, primaryKey: true },
    household_id: { type: DataTypes.INTEGER, allowNull: false },
  });
  await qi.addIndex('miss_rules', ['household_id', 'rule_id', 'miss_id']);

  await qi.createTable('photos', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    miss_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'misses', key: 'id' },
      onDelete: 'CASCADE',
    },
    position: { type: DataTypes.INTEGER, allowNull: false },
    content_type: { type: DataTypes.STRING(32), allowNull: false },
    storage_key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    thumb_key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    width: { type: DataTypes.INTEGER, allowNull: false },
    height: { type: DataTypes.INTEGER, allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    thumb_width: { type: DataTypes.INTEGER, allowNull: false },
    thumb_height: { type: DataTypes.INTEGER, allowNull: false },
    thumb_bytes: { type: DataTypes.INTEGER, allowNull: false },
    created_by: byUser,
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('photos', ['miss_id', 'position']);

  await qi.createTable('photo_marks', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    photo_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'photos', key: 'id' },
      onDelete: 'CASCADE',
    },
    x: { type: DataTypes.REAL, allowNull: false },
    y: { type: DataTypes.REAL, allowNull: false },
    label: { type: DataTypes.STRING(40), allowNull: true },
    created_by: byUser,
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('photo_marks', ['photo_id']);

  await qi.createTable('notes', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    miss_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'misses', key: 'id' },
      onDelete: 'CASCADE',
    },
    author_id: byUser,
    body: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('notes', ['miss_id', 'created_at']);
  await qi.addIndex('notes', ['author_id']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('notes');
  await qi.dropTable('photo_marks');
  await qi.dropTable('photos');
  await qi.dropTable('miss_rules');
  await qi.dropTable('miss_diagnoses');
  await qi.dropTable('misses');
}

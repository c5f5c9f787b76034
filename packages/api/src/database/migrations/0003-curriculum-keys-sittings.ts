import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

const household = {
  type: DataTypes.INTEGER,
  allowNull: false,
  references: { model: 'households', key: 'id' },
  onDelete: 'CASCADE',
};

export const name = '0003-curriculum-keys-sittings';

// misses.sitting_id and misses.key_item_id (0002, already indexed there) get no FK: SQLite
// cannot add one without rebuilding the misses table. They stay consistent because a key
// with sittings and an item with marks cannot be deleted, and a student's deletion
// cascades to both its sittings and its misses.

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('courses', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: household,
    name: { type: DataTypes.STRING(80), allowNull: false },
    level: { type: DataTypes.STRING(40), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('courses', ['household_id']);

  await qi.createTable('lessons', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    course_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'courses', key: 'id' },
      onDelete: 'CASCADE',
    },
    number: { type: DataTypes.INTEGER, allowNull: false },
    title: { type: DataTypes.STRING(120), allowNull: false },
    skills: { type: DataTypes.TEXT, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('lessons', ['course_id', 'number'], { unique: true });

  await qi.createTable('answer_keys', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: household,
    // A course with keys cannot be deleted (the service answers 409 first).
    course_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'courses', key: 'id' },
      onDelete: 'RESTRICT',
    },
    title: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    lesson_number: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('answer_keys', ['household_id']);
  await qi.addIndex('answer_keys', ['course_id']);

  await qi.createTable('key_items', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    answer_key_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'answer_keys', key: 'id' },
      onDelete: 'CASCADE',
    },
    number: { type: DataTypes.INTEGER, allowNull: false },
    prompt: { type: DataTypes.STRING(200), allowNull: false },
    answer: { type: DataTypes.STRING(80), allowNull: false },
    skills: { type: DataTypes.TEXT, allowNull: false },
    revisit: { type: DataTypes.TEXT, allowNull: false },
    facts: { type: DataTypes.TEXT, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('key_items', ['answer_key_id', 'number'], { unique: true });

  await qi.createTable('key_corrections', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    answer_key_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'answer_keys', key: 'id' },
      onDelete: 'CASCADE',
    },
    key_item_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'key_items', key: 'id' },
      onDelete: 'SET NULL',
    },
    item_number: { type: DataTypes.INTEGER, allowNull: false },
    changes: { type: DataTypes.TEXT, allowNull: false },
    reason: { type: DataTypes.STRING(300), allowNull: false },
    made_by_user_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    made_by_name: { type: DataTypes.STRING(80), allowNull: false },
    remarked: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('key_corrections', ['answer_key_id']);

  await qi.createTable('sittings', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: household,
    student_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'students', key: 'id' },
      onDelete: 'CASCADE',
    },
    // A key with sittings cannot be deleted (the service answers 409 first).
    answer_key_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'answer_keys', key: 'id' },
      onDelete: 'RESTRICT',
    },
    // The family's local clock time as typed, `YYYY-MM-DDTHH:mm` (no zone).
    started_at: { type: DataTypes.STRING(16), allowNull: false },
    time_of_day: { type: DataTypes.STRING(16), allowNull: false },
    minutes: { type: DataTypes.INTEGER, allowNull: true },
    rested: { type: DataTypes.BOOLEAN, allowNull: true },
    after_meal: { type: DataTypes.BOOLEAN, allowNull: true },
    note: { type: DataTypes.STRING(300), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sittings', ['household_id', 'student_id', 'started_at']);
  await qi.addIndex('sittings', ['answer_key_id']);

  await qi.createTable('sitting_marks', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    sitting_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'sittings', key: 'id' },
      onDelete: 'CASCADE',
    },
    key_item_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'key_items', key: 'id' },
      onDelete: 'CASCADE',
    },
    correct: { type: DataTypes.BOOLEAN, allowNull: false },
    answer: { type: DataTypes.STRING(80), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sitting_marks', ['sitting_id', 'key_item_id'], { unique: true });
  await qi.addIndex('sitting_marks', ['key_item_id']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('sitting_marks');
  await qi.dropTable('sittings');
  await qi.dropTable('key_corrections');
  await qi.dropTable('key_items');
  await qi.dropTable('answer_keys');
  await qi.dropTable('lessons');
  await qi.dropTable('courses');
}

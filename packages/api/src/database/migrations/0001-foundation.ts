import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

export const name = '0001-foundation';

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    display_name: { type: DataTypes.STRING(80), allowNull: false },
    password_hash: { type: DataTypes.STRING, allowNull: false },
    ...timestamps,
  });
  await qi.createTable('households', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    name: { type: DataTypes.STRING(80), allowNull: false },
    ...timestamps,
  });
  await qi.createTable('memberships', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'households', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    role: { type: DataTypes.STRING(16), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('memberships', ['household_id', 'user_id'], { unique: true });
  await qi.addIndex('memberships', ['user_id']);
  await qi.createTable('students', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'households', key: 'id' },
      onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(40), allowNull: false },
    grade_level: { type: DataTypes.STRING(4), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('students', ['household_id']);
  await qi.createTable('student_grants', {
    membership_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      primaryKey: true,
      references: { model: 'memberships', key: 'id' },
      onDelete: 'CASCADE',
    },
    student_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      primaryKey: true,
      references: { model: 'students', key: 'id' },
      onDelete: 'CASCADE',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('student_grants', ['student_id']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('student_grants');
  await qi.dropTable('students');
  await qi.dropTable('memberships');
  await qi.dropTable('households');
  await qi.dropTable('users');
}

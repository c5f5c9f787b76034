import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0004-members-mail';

const user = (onDelete: 'CASCADE' | 'SET NULL', allowNull: boolean) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: 'users', key: 'id' },
  onDelete,
});

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('invitations', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    household_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'households', key: 'id' },
      onDelete: 'CASCADE',
    },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    // JSON array of student ids a tutor will be granted; re-checked against the household on acceptance.
    student_ids: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
    // sha256 of the token in the link; the token itself is only ever in the e-mail.
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invited_by_id: user('SET NULL', true),
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_by_id: user('SET NULL', true),
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('invitations', ['household_id', 'email']);

  await qi.createTable('password_reset_tokens', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: user('CASCADE', false),
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('password_reset_tokens', ['user_id']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('password_reset_tokens');
  await qi.dropTable('invitations');
}

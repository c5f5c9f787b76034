import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0009-email-verification';

/**
 * A verified address: new accounts confirm theirs by a mailed single-use link before they can
 * invite, and ADMIN_EMAILS counts only a verified address. Accounts made before this migration
 * start unverified too (an address registered by someone else must not keep admin rights);
 * each can ask for a link from the app.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('users', 'email_verified_at', { type: DataTypes.DATE, allowNull: true });
  await qi.createTable('email_verification_tokens', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    // The address the link was sent to: a link for an address the account no longer has is void.
    email: { type: DataTypes.STRING(254), allowNull: false },
    // sha256 of the token in the link; the token itself is only ever in the e-mail.
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('email_verification_tokens', ['user_id']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('email_verification_tokens');
  await qi.removeColumn('users', 'email_verified_at');
}

import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Invitations and password resets (one-time tokens stored only as SHA-256 hashes), the local
// mail outbox, the audit log and per-person notification preferences.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('invitations', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    firm_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    // pending | accepted | revoked | replaced (expired is read from expires_at)
    status: { type: DataTypes.STRING(20), allowNull: false },
    invited_by: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_user_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('invitations', ['firm_id', 'status'], { name: 'invitations_firm_status' });

  await qi.createTable('password_resets', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    user_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    // pending | used | superseded (expired is read from expires_at)
    status: { type: DataTypes.STRING(20), allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('password_resets', ['user_id'], { name: 'password_resets_user_id' });

  await qi.createTable('outbox_messages', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    // The firm whose owners may read it; null for mail that belongs to no firm.
    firm_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    from_address: { type: DataTypes.STRING(320), allowNull: false },
    to_address: { type: DataTypes.STRING(320), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: false },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('outbox_messages', ['firm_id', 'sent_at'], { name: 'outbox_messages_firm_sent' });

  await qi.createTable('audit_events', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    firm_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    // Who did it; kept readable through actor_label when the account is later deleted.
    user_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    actor_label: { type: DataTypes.STRING(320), allowNull: true },
    action: { type: DataTypes.STRING(80), allowNull: false },
    target: { type: DataTypes.STRING(300), allowNull: true },
    detail: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('audit_events', ['firm_id', 'created_at'], { name: 'audit_events_firm_created' });
  await qi.addIndex('audit_events', ['firm_id', 'action'], { name: 'audit_events_firm_action' });

  await qi.createTable('notification_preferences', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    user_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    firm_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    scheme_submitted: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    scheme_chosen: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('notification_preferences', ['firm_id', 'user_id'], {
    unique: true,
    name: 'notification_preferences_firm_user_unique',
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('notification_preferences');
  await qi.dropTable('audit_events');
  await qi.dropTable('outbox_messages');
  await qi.dropTable('password_resets');
  await qi.dropTable('invitations');
};

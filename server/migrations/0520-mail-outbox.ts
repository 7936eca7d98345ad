import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/**
 * The mail outbox (written in the transaction of the action that sends it, sent after commit with retry) and the
 * messages the local fake SMTP server captured (development and tests only).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('mail_outbox', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(200), allowNull: false },
    // Bodies carry single-use links, so they are dropped once the message is sent.
    text_body: { type: DataTypes.TEXT, allowNull: true },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE, allowNull: false },
    locked_until: { type: DataTypes.DATE, allowNull: true },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('mail_outbox', ['status', 'next_attempt_at'], { name: 'mail_outbox_due' });
  await qi.createTable('captured_mails', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    mail_from: { type: DataTypes.STRING(254), allowNull: false },
    mail_to: { type: DataTypes.STRING(1000), allowNull: false },
    subject: { type: DataTypes.STRING(200), allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: true },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('captured_mails');
  await qi.dropTable('mail_outbox');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_mail_outbox_status');
};

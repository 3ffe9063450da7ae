/**
 * Hardening: sessions keyed by the SHA-256 of their token (every stored session is ended, since a
 * plain token cannot be told from a hash), who invited whom (an approval is refused when the
 * approver was invited by the plan's author or an editor), and mail bodies that fit any message.
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.bulkDelete('sessions', {});
  await qi.changeColumn('sessions', 'id', { type: DataTypes.CHAR(64), allowNull: false });
  await qi.addColumn('users', 'invited_by', { type: DataTypes.STRING(32), allowNull: true });
  await qi.changeColumn('mail_outbox', 'text_body', { type: DataTypes.TEXT('medium'), allowNull: false });
  await qi.changeColumn('mail_outbox', 'html_body', { type: DataTypes.TEXT('medium'), allowNull: false });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.changeColumn('mail_outbox', 'html_body', { type: DataTypes.TEXT, allowNull: false });
  await qi.changeColumn('mail_outbox', 'text_body', { type: DataTypes.TEXT, allowNull: false });
  await qi.removeColumn('users', 'invited_by');
  await qi.bulkDelete('sessions', {});
  await qi.changeColumn('sessions', 'id', { type: DataTypes.STRING(255), allowNull: false });
};

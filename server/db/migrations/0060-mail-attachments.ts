import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Mail may carry attachments (a calendar invitation with a drop-off confirmation). The outbox keeps
 * them with the message so a delayed send still has them; the local catcher keeps what arrived so
 * the mail page can show it.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('mail_outbox', 'attachments', { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn('caught_mail', 'attachments', { type: DataTypes.JSON, allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('caught_mail', 'attachments');
  await qi.removeColumn('mail_outbox', 'attachments');
}

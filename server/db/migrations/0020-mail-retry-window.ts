import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Mail is retried for days rather than a fixed number of attempts: each message carries the time
 * after which the worker stops trying on its own (empty on older rows: seven days from when it was
 * written), and when a coordinator gave it up, if one did.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('mail_outbox', 'retryUntil', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('mail_outbox', 'givenUpAt', { type: DataTypes.DATE, allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('mail_outbox', 'givenUpAt');
  await qi.removeColumn('mail_outbox', 'retryUntil');
}

import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The maker's choice of a thank-you e-mail when their blankets are delivered (off unless they opt in),
 * and on each blanket the moment its thank-you was written, so a delivery undone and made again
 * never thanks anyone twice for the same blanket.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('users', 'thankYouMail', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.addColumn('blankets', 'thankedAt', { type: DataTypes.DATE, allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('blankets', 'thankedAt');
  await qi.removeColumn('users', 'thankYouMail');
}

import { DataTypes, type QueryInterface } from 'sequelize';

/** A booking an organiser marked "did not come": when, and by whom (its status becomes 'missed'). */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('bookings', 'missedAt', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('bookings', 'missedById', { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('bookings', 'missedById');
  await qi.removeColumn('bookings', 'missedAt');
}

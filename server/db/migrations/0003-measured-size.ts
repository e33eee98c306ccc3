import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The size measured at intake is kept beside the size the maker logged instead of overwriting it:
 * the maker's page and the intake view show both, and checks and manifests use the measured one.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('blankets', 'measuredWidthCm', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('blankets', 'measuredLengthCm', { type: DataTypes.DOUBLE, allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('blankets', 'measuredLengthCm');
  await qi.removeColumn('blankets', 'measuredWidthCm');
}

import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const fk = (model: string, allowNull: boolean, onDelete: 'CASCADE' | 'SET NULL' | 'RESTRICT') => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model, key: 'id' },
  onDelete,
});

/** Delivery runs, their ordered stops, the blankets on each stop in numbered boxes, and the manifests written. */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('runs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    runDate: { type: DataTypes.DATEONLY, allowNull: false },
    driverId: fk('users', false, 'RESTRICT'),
    startSiteId: fk('sites', false, 'RESTRICT'),
    createdById: fk('users', true, 'SET NULL'),
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.addIndex('runs', ['runDate'], { name: 'runs_run_date' });
  await qi.createTable('run_stops', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    runId: fk('runs', false, 'CASCADE'),
    recipientId: fk('recipients', false, 'RESTRICT'),
    position: { type: DataTypes.INTEGER, allowNull: false },
    packedAt: { type: DataTypes.DATE, allowNull: true },
    deliveredAt: { type: DataTypes.DATE, allowNull: true },
    receivedCount: { type: DataTypes.INTEGER, allowNull: true },
    signedBy: { type: DataTypes.STRING(120), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  // One stop per recipient on a run: a second visit the same day is the same stop.
  await qi.addIndex('run_stops', ['runId', 'recipientId'], { unique: true, name: 'run_stops_run_recipient' });
  await qi.createTable('run_blankets', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    runId: fk('runs', false, 'CASCADE'),
    stopId: fk('run_stops', false, 'CASCADE'),
    blanketId: fk('blankets', false, 'CASCADE'),
    box: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    ...timestamps,
  });
  // A blanket rides on one run at a time: the database refuses a second, whatever the race.
  await qi.addIndex('run_blankets', ['blanketId'], { unique: true, name: 'run_blankets_blanket' });
  // The manifest reads a stop's blankets box by box in this order, a page at a time.
  await qi.addIndex('run_blankets', ['stopId', 'box', 'blanketId'], { name: 'run_blankets_stop_box_blanket' });
  await qi.createTable('exports', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(20), allowNull: false },
    runId: fk('runs', true, 'SET NULL'),
    recipientId: fk('recipients', true, 'SET NULL'),
    title: { type: DataTypes.STRING(300), allowNull: false },
    fileName: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    rows: { type: DataTypes.INTEGER, allowNull: false },
    bom: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdById: fk('users', true, 'SET NULL'),
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('exports', ['createdAt'], { name: 'exports_created_at' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('exports');
  await qi.dropTable('run_blankets');
  await qi.dropTable('run_stops');
  await qi.dropTable('runs');
}

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

/** Recipients, their needs, drop-off sites, pledges, blankets with history and photos, saved plans. */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('recipients', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    kind: { type: DataTypes.STRING(30), allowNull: false },
    population: { type: DataTypes.STRING(20), allowNull: false },
    address: { type: DataTypes.STRING(400), allowNull: false },
    lat: { type: DataTypes.DOUBLE, allowNull: true },
    lng: { type: DataTypes.DOUBLE, allowNull: true },
    contactName: { type: DataTypes.STRING(200), allowNull: true },
    contactEmail: { type: DataTypes.STRING(254), allowNull: true },
    contactPhone: { type: DataTypes.STRING(60), allowNull: true },
    deliveryNotes: { type: DataTypes.TEXT, allowNull: true },
    guidelines: { type: DataTypes.JSON, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.createTable('needs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    recipientId: fk('recipients', false, 'CASCADE'),
    sizeCategory: { type: DataTypes.STRING(20), allowNull: false },
    quantity: { type: DataTypes.INTEGER, allowNull: false },
    deadline: { type: DataTypes.DATEONLY, allowNull: false },
    preferences: { type: DataTypes.TEXT, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.addIndex('needs', ['recipientId']);
  await qi.createTable('sites', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    address: { type: DataTypes.STRING(400), allowNull: false },
    lat: { type: DataTypes.DOUBLE, allowNull: true },
    lng: { type: DataTypes.DOUBLE, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...timestamps,
  });
  await qi.createTable('plans', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: fk('users', false, 'CASCADE'),
    name: { type: DataTypes.STRING(120), allowNull: false },
    input: { type: DataTypes.JSON, allowNull: false },
    summary: { type: DataTypes.JSON, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('plans', ['userId']);
  await qi.createTable('pledges', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: fk('users', false, 'CASCADE'),
    needId: fk('needs', true, 'SET NULL'),
    quantity: { type: DataTypes.INTEGER, allowNull: false },
    sizeCategory: { type: DataTypes.STRING(20), allowNull: false },
    dueDate: { type: DataTypes.DATEONLY, allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'active' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.addIndex('pledges', ['userId']);
  await qi.addIndex('pledges', ['needId']);
  await qi.createTable('blankets', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    code: { type: DataTypes.STRING(12), allowNull: false, unique: true },
    userId: fk('users', false, 'RESTRICT'),
    pledgeId: fk('pledges', true, 'SET NULL'),
    recipientId: fk('recipients', true, 'SET NULL'),
    siteId: fk('sites', true, 'SET NULL'),
    planId: fk('plans', true, 'SET NULL'),
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'in_progress' },
    widthCm: { type: DataTypes.DOUBLE, allowNull: false },
    lengthCm: { type: DataTypes.DOUBLE, allowNull: false },
    yarnWeight: { type: DataTypes.INTEGER, allowNull: false },
    fibres: { type: DataTypes.JSON, allowNull: false },
    colours: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    bodyStitch: { type: DataTypes.STRING(30), allowNull: false, defaultValue: 'other' },
    borderId: { type: DataTypes.STRING(60), allowNull: true },
    features: { type: DataTypes.JSON, allowNull: false },
    machineWashable: { type: DataTypes.BOOLEAN, allowNull: false },
    dryerSafe: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    smokeFree: { type: DataTypes.BOOLEAN, allowNull: false },
    petFree: { type: DataTypes.BOOLEAN, allowNull: false },
    newYarn: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    labelName: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'first-name' },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    receivedAt: { type: DataTypes.DATE, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.addIndex('blankets', ['userId']);
  await qi.addIndex('blankets', ['status']);
  await qi.addIndex('blankets', ['recipientId']);
  await qi.createTable('blanket_events', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    blanketId: fk('blankets', false, 'CASCADE'),
    actorId: fk('users', true, 'SET NULL'),
    kind: { type: DataTypes.STRING(30), allowNull: false },
    fromStatus: { type: DataTypes.STRING(20), allowNull: true },
    toStatus: { type: DataTypes.STRING(20), allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: true },
    data: { type: DataTypes.JSON, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('blanket_events', ['blanketId']);
  await qi.createTable('photos', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    blanketId: fk('blankets', false, 'CASCADE'),
    fileName: { type: DataTypes.STRING(80), allowNull: false },
    thumbName: { type: DataTypes.STRING(80), allowNull: false },
    mime: { type: DataTypes.STRING(40), allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    width: { type: DataTypes.INTEGER, allowNull: true },
    height: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('photos', ['blanketId']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const t of ['photos', 'blanket_events', 'blankets', 'pledges', 'plans', 'sites', 'needs', 'recipients']) {
    await qi.dropTable(t);
  }
}

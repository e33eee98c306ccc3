import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    passwordHash: { type: DataTypes.STRING(300), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'volunteer' },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    town: { type: DataTypes.STRING(120), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.createTable('password_resets', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('mail_outbox', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    to: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    nextAttemptAt: { type: DataTypes.DATE, allowNull: false },
    lastError: { type: DataTypes.TEXT, allowNull: true },
    sentAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('mail_outbox', ['status', 'nextAttemptAt']);
  await qi.createTable('caught_mail', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    from: { type: DataTypes.STRING(300), allowNull: false },
    to: { type: DataTypes.STRING(1000), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    receivedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    userId: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sessions', ['expires']);
  await qi.createTable('drives', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    town: { type: DataTypes.STRING(120), allowNull: false },
    summary: { type: DataTypes.TEXT, allowNull: false },
    startsOn: { type: DataTypes.DATEONLY, allowNull: false },
    endsOn: { type: DataTypes.DATEONLY, allowNull: false },
    ...timestamps,
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const t of ['drives', 'sessions', 'caught_mail', 'mail_outbox', 'password_resets', 'users']) {
    await qi.dropTable(t);
  }
}

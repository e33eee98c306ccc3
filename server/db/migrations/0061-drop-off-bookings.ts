import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Drop-off scheduling: the drive's time zone, each site's opening hours, slot length, visits per slot
 * and closures, the bookings with the blankets each one brings, and each person's reminder choice.
 * Times are stored in UTC; the drive's zone turns them into the wall clock people read.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('drives', 'timeZone', { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'Europe/London' });
  await qi.addColumn('sites', 'openingHours', { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn('sites', 'slotMinutes', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 });
  await qi.addColumn('sites', 'slotCapacity', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 2 });
  await qi.addColumn('sites', 'closures', { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn('users', 'bookingReminders', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true });
  await qi.createTable('bookings', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    siteId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sites', key: 'id' } },
    startsAt: { type: DataTypes.DATE, allowNull: false },
    endsAt: { type: DataTypes.DATE, allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'booked' },
    sequence: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    reminderDueAt: { type: DataTypes.DATE, allowNull: true },
    reminderDoneAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  });
  await qi.addIndex('bookings', ['siteId', 'startsAt', 'status'], { name: 'bookings_site_start_status' });
  await qi.addIndex('bookings', ['userId', 'startsAt'], { name: 'bookings_user_start' });
  await qi.addIndex('bookings', ['status', 'reminderDoneAt', 'reminderDueAt'], { name: 'bookings_reminder_due' });
  await qi.createTable('booking_blankets', {
    bookingId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'bookings', key: 'id' }, onDelete: 'CASCADE' },
    blanketId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'blankets', key: 'id' }, onDelete: 'CASCADE' },
  });
  await qi.addIndex('booking_blankets', ['blanketId'], { name: 'booking_blankets_blanket' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('booking_blankets');
  await qi.dropTable('bookings');
  await qi.removeColumn('users', 'bookingReminders');
  for (const c of ['closures', 'slotCapacity', 'slotMinutes', 'openingHours']) await qi.removeColumn('sites', c);
  await qi.removeColumn('drives', 'timeZone');
}

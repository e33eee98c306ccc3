import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { BookingStatus } from '@shared/schemas/booking';

/** A maker's visit to a drop-off site in one slot, bringing one or more finished blankets. */
export class Booking extends Model<InferAttributes<Booking>, InferCreationAttributes<Booking>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare siteId: number;
  declare startsAt: Date;
  declare endsAt: Date;
  declare status: CreationOptional<BookingStatus>;
  /** RFC 5545 SEQUENCE: raised on every change so calendars replace the entry they hold. */
  declare sequence: CreationOptional<number>;
  declare reminderDueAt: CreationOptional<Date | null>;
  /** Set when the reminder was sent, or skipped because the maker turned reminders off. */
  declare reminderDoneAt: CreationOptional<Date | null>;
  /** When an organiser marked that the maker did not come, and who did. */
  declare missedAt: CreationOptional<Date | null>;
  declare missedById: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare version: CreationOptional<number>;
}

/** Which blankets a booking brings. Kept after a cancellation, so the history can say what was booked. */
export class BookingBlanket extends Model<InferAttributes<BookingBlanket>, InferCreationAttributes<BookingBlanket>> {
  declare bookingId: number;
  declare blanketId: number;
}

export function initBooking(sequelize: Sequelize) {
  Booking.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      siteId: { type: DataTypes.INTEGER, allowNull: false },
      startsAt: { type: DataTypes.DATE, allowNull: false },
      endsAt: { type: DataTypes.DATE, allowNull: false },
      status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'booked' },
      sequence: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      reminderDueAt: { type: DataTypes.DATE, allowNull: true },
      reminderDoneAt: { type: DataTypes.DATE, allowNull: true },
      missedAt: { type: DataTypes.DATE, allowNull: true },
      missedById: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    },
    { sequelize, tableName: 'bookings', version: true },
  );
  BookingBlanket.init(
    {
      bookingId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      blanketId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    },
    { sequelize, tableName: 'booking_blankets', timestamps: false },
  );
}

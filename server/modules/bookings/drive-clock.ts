import type { Transaction } from 'sequelize';
import { Drive } from '../../db/models/drive';

/** The fallback when no drive row exists yet (a fresh database before seeding). */
export const DEFAULT_TIME_ZONE = 'Europe/London';

/** The drive's IANA time zone: every slot, booking time and "today" is read in it. */
export async function driveZone(transaction?: Transaction): Promise<string> {
  const drive = await Drive.findOne({ order: [['id', 'ASC']], attributes: ['id', 'timeZone'], transaction });
  return drive?.timeZone ?? DEFAULT_TIME_ZONE;
}

export async function setDriveZone(timeZone: string, transaction: Transaction): Promise<string> {
  const drive = await Drive.findOne({ order: [['id', 'ASC']], transaction });
  if (!drive) return timeZone;
  drive.timeZone = timeZone;
  await drive.save({ transaction });
  return drive.timeZone;
}

import type { Transaction } from 'sequelize';
import { Drive } from '../../db/models/drive';
import { nowMs } from '../../lib/clock';
import { preparedRead } from '../../db/prepared-read';
import { keptUntilWrite } from '../../db/kept';
import { DateTime } from 'luxon';
import { todayIn } from '@shared/scheduling/slots';

/** The fallback when no drive row exists yet (a fresh database before seeding). */
export const DEFAULT_TIME_ZONE = 'Europe/London';

/** The drive's IANA time zone: every slot, booking time and "today" is read in it. */
export async function driveZone(transaction?: Transaction): Promise<string> {
  if (!transaction) {
    // Most reads ask for the day; outside a transaction the zone is kept until the next write
    // (server/db/kept.ts) and read through a prepared statement (server/db/prepared-read.ts).
    return keptUntilWrite(Drive.sequelize!, 'drive-zone', async () => {
      const [row] = await preparedRead<{ timeZone: string }>(Drive.sequelize!, 'SELECT timeZone FROM drives ORDER BY id ASC LIMIT 1', []);
      return row?.timeZone ?? DEFAULT_TIME_ZONE;
    });
  }
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

export interface DriveNow {
  zone: string;
  /** The product clock's instant (lib/clock). */
  nowMs: number;
  /** The drive's date at that instant, YYYY-MM-DD in its zone. */
  today: string;
}

/**
 * The one answer to "what day is it": the drive's local date, read in its zone from the product clock.
 * A pledge's lateness, the intake queue's day, open needs and runs all start from here, never from
 * the server's zone or UTC.
 */
export async function driveNow(transaction?: Transaction): Promise<DriveNow> {
  const zone = await driveZone(transaction);
  const at = nowMs();
  return { zone, nowMs: at, today: dayAt(zone, at) };
}

/**
 * The drive's date at an instant, remembered with the instants its day starts and ends: most
 * requests ask for it, and working it out through the time-zone rules each time was a measurable
 * part of a kept answer's cost.
 */
let lastDay: { zone: string; from: number; to: number; today: string } | null = null;
function dayAt(zone: string, at: number): string {
  if (lastDay && lastDay.zone === zone && at >= lastDay.from && at < lastDay.to) return lastDay.today;
  const local = DateTime.fromMillis(at, { zone });
  const today = todayIn(zone, at);
  lastDay = { zone, from: local.startOf('day').toMillis(), to: local.plus({ days: 1 }).startOf('day').toMillis(), today };
  return today;
}

/**
 * The product-clock instants at which the drive's day last worked out starts and ends (an empty
 * span before any was), for answers kept only while the clock is within the day they were read on.
 */
export const driveDaySpan = (): { from: number; to: number } => (lastDay ? { from: lastDay.from, to: lastDay.to } : { from: 0, to: 0 });

export async function driveToday(transaction?: Transaction): Promise<string> {
  return (await driveNow(transaction)).today;
}

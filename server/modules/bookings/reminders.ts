import { Op, type Sequelize } from 'sequelize';
import { Booking } from '../../db/models/booking';
import { Blanket } from '../../db/models/blanket';
import { Site } from '../../db/models/site';
import { User } from '../../db/models/user';
import { enqueueMail } from '../../mail/outbox';
import { bookingReminderMail } from './booking-mail';
import { driveZone } from './drive-clock';
import { now as clockNow } from '../../lib/clock';
import { appLinks } from '../../mail/links';

export interface ReminderContext {
  sequelize: Sequelize;
  publicUrl: string;
}

/**
 * Sends the day-before reminders that are due at `now`. Each booking's reminder is marked done in the
 * same transaction that puts the mail in the outbox, so it goes out once however often this runs and
 * whether or not the server restarted in between; a maker who turned reminders off is marked done
 * without a message. A booking that has begun, or was cancelled, gets none.
 */
export async function sendDueReminders(ctx: ReminderContext, now: Date = clockNow()) {
  const due = await Booking.findAll({
    attributes: ['id'],
    where: { status: 'booked', reminderDoneAt: null, reminderDueAt: { [Op.lte]: now }, startsAt: { [Op.gt]: now } },
    order: [['reminderDueAt', 'ASC']],
    limit: 200,
  });
  let sent = 0;
  let skipped = 0;
  for (const { id } of due) {
    await ctx.sequelize.transaction(async (transaction) => {
      const b = (await Booking.findByPk(id, {
        include: [
          { model: Site, as: 'site' },
          { model: User, as: 'maker', attributes: ['id', 'name', 'email', 'bookingReminders'] },
          { model: Blanket, as: 'blankets', attributes: ['id', 'code', 'status'], through: { attributes: [] } },
        ],
        transaction,
      })) as (Booking & { site: Site; maker: User; blankets: Blanket[] }) | null;
      // Checked again inside the write lock: another pass may have sent it, the maker may have cancelled.
      if (!b || b.status !== 'booked' || b.reminderDoneAt !== null || b.startsAt <= now) return;
      b.reminderDoneAt = now;
      await b.save({ transaction });
      if (!b.maker.bookingReminders) {
        skipped++;
        return;
      }
      const zone = await driveZone(transaction);
      const codes = b.blankets.filter((x) => x.status === 'booked').map((x) => x.code).sort();
      const mail = bookingReminderMail({
        name: b.maker.name,
        siteName: b.site.name,
        siteAddress: b.site.address,
        siteNotes: b.site.notes ?? null,
        startsAt: b.startsAt,
        endsAt: b.endsAt,
        timeZone: zone,
        blanketCodes: codes,
        appUrl: appLinks.dropOff(ctx.publicUrl),
      });
      await enqueueMail({ to: b.maker.email, ...mail }, transaction);
      sent++;
    });
  }
  return { due: due.length, sent, skipped };
}

/**
 * The reminder clock inside the server. State lives in the database (reminderDueAt / reminderDoneAt),
 * so a restart picks up whatever fell due while it was down. `clock` lets a test set the time.
 */
export function startReminderScheduler(ctx: ReminderContext, intervalMs = 60_000, clock: () => Date = clockNow) {
  let running = false;
  const tick = async () => {
    if (running) return;
    running = true;
    try {
      await sendDueReminders(ctx, clock());
    } catch (err) {
      console.error('drop-off reminders:', (err as Error).message);
    } finally {
      running = false;
    }
  };
  const timer = setInterval(tick, intervalMs);
  timer.unref();
  void tick();
  return () => clearInterval(timer);
}

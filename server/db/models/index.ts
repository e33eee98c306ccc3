import type { Sequelize } from 'sequelize';
import { initUser } from './user';
import { initPasswordReset, PasswordReset } from './password-reset';
import { initMailMessage } from './mail-message';
import { initCaughtMail } from './caught-mail';
import { initSession } from './session';
import { initDrive } from './drive';
import { User } from './user';
import { initRecipient, Recipient } from './recipient';
import { initNeed, Need } from './need';
import { initSite, Site } from './site';
import { initPledge, Pledge } from './pledge';
import { initBlanket, Blanket } from './blanket';
import { initBlanketEvent, BlanketEvent } from './blanket-event';
import { initPhoto, Photo } from './photo';
import { initPlan, Plan } from './plan';
import { Booking, BookingBlanket, initBooking } from './booking';
import { initAssignment, Assignment } from './assignment';
import { initRuns, Run, RunStop, RunBlanket, Export } from './run';

/**
 * Every model is initialised here and every association is declared here, in one place.
 * Feature models append their init call and associations below.
 */
export function initModels(sequelize: Sequelize) {
  initUser(sequelize);
  initPasswordReset(sequelize);
  initMailMessage(sequelize);
  initCaughtMail(sequelize);
  initSession(sequelize);
  initDrive(sequelize);
  initRecipient(sequelize);
  initNeed(sequelize);
  initSite(sequelize);
  initPledge(sequelize);
  initBlanket(sequelize);
  initBlanketEvent(sequelize);
  initPhoto(sequelize);
  initPlan(sequelize);
  initBooking(sequelize);
  initAssignment(sequelize);
  initRuns(sequelize);

  PasswordReset.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  User.hasMany(PasswordReset, { foreignKey: 'userId', as: 'passwordResets' });

  Recipient.hasMany(Need, { foreignKey: 'recipientId', as: 'needs' });
  Need.belongsTo(Recipient, { foreignKey: 'recipientId', as: 'recipient' });

  User.hasMany(Pledge, { foreignKey: 'userId', as: 'pledges' });
  Pledge.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Need.hasMany(Pledge, { foreignKey: 'needId', as: 'pledges' });
  Pledge.belongsTo(Need, { foreignKey: 'needId', as: 'need' });

  User.hasMany(Blanket, { foreignKey: 'userId', as: 'blankets' });
  Blanket.belongsTo(User, { foreignKey: 'userId', as: 'maker' });
  Pledge.hasMany(Blanket, { foreignKey: 'pledgeId', as: 'blankets' });
  Blanket.belongsTo(Pledge, { foreignKey: 'pledgeId', as: 'pledge' });
  Recipient.hasMany(Blanket, { foreignKey: 'recipientId', as: 'blankets' });
  Blanket.belongsTo(Recipient, { foreignKey: 'recipientId', as: 'recipient' });
  Site.hasMany(Blanket, { foreignKey: 'siteId', as: 'blankets' });
  Blanket.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });
  Plan.hasMany(Blanket, { foreignKey: 'planId', as: 'blankets' });
  Blanket.belongsTo(Plan, { foreignKey: 'planId', as: 'plan' });
  User.hasMany(Plan, { foreignKey: 'userId', as: 'plans' });
  Plan.belongsTo(User, { foreignKey: 'userId', as: 'owner' });

  Blanket.hasMany(BlanketEvent, { foreignKey: 'blanketId', as: 'events' });
  BlanketEvent.belongsTo(Blanket, { foreignKey: 'blanketId', as: 'blanket' });
  BlanketEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
  Blanket.hasMany(Photo, { foreignKey: 'blanketId', as: 'photos' });
  Photo.belongsTo(Blanket, { foreignKey: 'blanketId', as: 'blanket' });

  User.hasMany(Booking, { foreignKey: 'userId', as: 'bookings' });
  Booking.belongsTo(User, { foreignKey: 'userId', as: 'maker' });
  Booking.belongsTo(User, { foreignKey: 'missedById', as: 'missedBy', constraints: false });
  Site.hasMany(Booking, { foreignKey: 'siteId', as: 'bookings' });
  Booking.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });
  Booking.belongsToMany(Blanket, { through: BookingBlanket, foreignKey: 'bookingId', otherKey: 'blanketId', as: 'blankets' });
  Blanket.belongsToMany(Booking, { through: BookingBlanket, foreignKey: 'blanketId', otherKey: 'bookingId', as: 'bookings' });
  Blanket.hasMany(Assignment, { foreignKey: 'blanketId', as: 'assignments' });
  Assignment.belongsTo(Blanket, { foreignKey: 'blanketId', as: 'blanket' });
  Need.hasMany(Assignment, { foreignKey: 'needId', as: 'assignments' });
  Assignment.belongsTo(Need, { foreignKey: 'needId', as: 'need' });
  Assignment.belongsTo(Recipient, { foreignKey: 'recipientId', as: 'recipient' });
  Assignment.belongsTo(Recipient, { foreignKey: 'priorRecipientId', as: 'priorRecipient' });
  Assignment.belongsTo(User, { foreignKey: 'assignedById', as: 'assignedBy' });
  Run.belongsTo(User, { foreignKey: 'driverId', as: 'driver' });
  Run.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
  Run.belongsTo(Site, { foreignKey: 'startSiteId', as: 'startSite' });
  Run.hasMany(RunStop, { foreignKey: 'runId', as: 'stops' });
  RunStop.belongsTo(Run, { foreignKey: 'runId', as: 'run' });
  RunStop.belongsTo(Recipient, { foreignKey: 'recipientId', as: 'recipient' });
  RunStop.hasMany(RunBlanket, { foreignKey: 'stopId', as: 'items' });
  RunBlanket.belongsTo(RunStop, { foreignKey: 'stopId', as: 'stop' });
  RunBlanket.belongsTo(Run, { foreignKey: 'runId', as: 'run' });
  RunBlanket.belongsTo(Blanket, { foreignKey: 'blanketId', as: 'blanket' });
  Blanket.hasOne(RunBlanket, { foreignKey: 'blanketId', as: 'runItem' });
  Export.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
  Export.belongsTo(Run, { foreignKey: 'runId', as: 'run' });
  Export.belongsTo(Recipient, { foreignKey: 'recipientId', as: 'recipient' });
}

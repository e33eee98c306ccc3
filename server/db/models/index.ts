import type { Sequelize } from 'sequelize';
import { initUser } from './user';
import { initPasswordReset, PasswordReset } from './password-reset';
import { initMailMessage } from './mail-message';
import { initCaughtMail } from './caught-mail';
import { initSession } from './session';
import { initDrive } from './drive';
import { User } from './user';

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

  PasswordReset.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  User.hasMany(PasswordReset, { foreignKey: 'userId', as: 'passwordResets' });
}

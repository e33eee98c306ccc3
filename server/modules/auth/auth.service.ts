import { createHash, randomBytes } from 'node:crypto';
import { Op, type Sequelize } from 'sequelize';
import { User } from '../../db/models/user';
import { PasswordReset } from '../../db/models/password-reset';
import { Session } from '../../db/models/session';
import { enqueueMail } from '../../mail/outbox';
import { passwordResetMail, welcomeMail } from '../../mail/templates';
import { appLinks } from '../../mail/links';
import { hashPassword } from '../../auth/password';
import { HttpError } from '../../lib/http-error';

export const RESET_MINUTES = 60;
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

export interface AuthContext {
  sequelize: Sequelize;
  scryptLogN: number;
  publicUrl: string;
}

export async function register(ctx: AuthContext, input: { name: string; email: string; password: string }) {
  const passwordHash = await hashPassword(input.password, ctx.scryptLogN);
  return ctx.sequelize.transaction(async (transaction) => {
    const existing = await User.findOne({ where: { email: input.email }, transaction });
    if (existing) throw new HttpError(409, 'An account with this e-mail already exists; try signing in or resetting the password', [{ path: 'email', message: 'Already registered' }]);
    const user = await User.create({ name: input.name, email: input.email, passwordHash, role: 'volunteer' }, { transaction });
    await enqueueMail({ to: user.email, ...welcomeMail(user.name, ctx.publicUrl) }, transaction);
    return user.toPublic();
  });
}

/** Always succeeds from the caller's view, so the form can't be used to learn who has an account. */
export async function requestPasswordReset(ctx: AuthContext, email: string) {
  const user = await User.findOne({ where: { email } });
  if (!user || !user.active) return;
  const token = randomBytes(32).toString('base64url');
  await ctx.sequelize.transaction(async (transaction) => {
    // A new link replaces any earlier unused one.
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null }, transaction });
    await PasswordReset.create(
      { userId: user.id, tokenHash: sha256(token), expiresAt: new Date(Date.now() + RESET_MINUTES * 60_000) },
      { transaction },
    );
    const link = appLinks.resetPassword(ctx.publicUrl, token);
    await enqueueMail({ to: user.email, ...passwordResetMail(user.name, link, RESET_MINUTES) }, transaction);
  });
}

export async function confirmPasswordReset(ctx: AuthContext, token: string, password: string) {
  const passwordHash = await hashPassword(password, ctx.scryptLogN);
  return ctx.sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({
      where: { tokenHash: sha256(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction,
    });
    if (!reset) throw new HttpError(400, 'This reset link has expired or was already used; ask for a new one', [{ path: 'token', message: 'Expired or used' }]);
    const user = await User.findByPk(reset.userId, { transaction });
    if (!user || !user.active) throw new HttpError(400, 'This reset link is no longer valid', [{ path: 'token', message: 'Invalid' }]);
    await reset.update({ usedAt: new Date() }, { transaction });
    user.passwordHash = passwordHash;
    await user.save({ transaction });
    // Sign the account out everywhere: whoever knew the old password loses their session too.
    await Session.destroy({ where: { userId: user.id }, transaction });
    return user.toPublic();
  });
}

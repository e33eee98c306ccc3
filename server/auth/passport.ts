import passport, { type PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Role } from '@shared/schemas/user';
import { User } from '../db/models/user';
import { preparedRead } from '../db/prepared-read';
import { keptUntilWrite } from '../db/kept';
import { dummyVerify, hashCost, hashPassword, verifyPassword } from './password';

export function configurePassport(scryptLogN: number): PassportStatic {
  const p = new passport.Passport() as unknown as PassportStatic;
  p.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
        if (!user || !user.active) {
          await dummyVerify(password, scryptLogN);
          return done(null, false);
        }
        if (!(await verifyPassword(password, user.passwordHash))) return done(null, false);
        // Raise an old, cheaper hash to the current cost while we hold the plain password.
        if ((hashCost(user.passwordHash) ?? 0) < scryptLogN) {
          user.passwordHash = await hashPassword(password, scryptLogN);
          await user.save();
        }
        return done(null, user.toPublic());
      } catch (err) {
        return done(err);
      }
    }),
  );
  p.serializeUser((user, done) => done(null, user.id));
  // Every signed-in request comes through here: one prepared statement reads what toPublic() gives,
  // kept until anything is written (server/db/kept.ts), so a deactivation or a change of role
  // holds from the next request on.
  p.deserializeUser(async (id: number, done) => {
    try {
      const [row] = await keptUntilWrite(User.sequelize!, `user ${id}`, () =>
        preparedRead<{ id: number; name: string; email: string; role: Role; active: number }>(
          User.sequelize!,
          'SELECT id, name, email, role, active FROM users WHERE id = ?',
          [id],
        ),
      );
      done(null, row && row.active ? { ...row, active: true } : false);
    } catch (err) {
      done(err);
    }
  });
  return p;
}

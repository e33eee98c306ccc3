import passport, { type PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { User } from '../db/models/user';
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
  p.deserializeUser(async (id: number, done) => {
    try {
      const user = await User.findByPk(id);
      done(null, user && user.active ? user.toPublic() : false);
    } catch (err) {
      done(err);
    }
  });
  return p;
}

import passport, { type PassportStatic } from 'passport';
import type { AuthService } from './auth-service';

/** Sessions hold only the user id; roles are read fresh on every request so a role change applies at once. */
export function configurePassport(auth: AuthService): PassportStatic {
  const p = new passport.Passport();
  p.serializeUser((user, done) => done(null, user.id));
  p.deserializeUser((id: number, done) => {
    auth.currentUser(Number(id)).then((user) => done(null, user ?? false), done);
  });
  return p as unknown as PassportStatic;
}

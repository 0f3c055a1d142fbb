// Passport with a local strategy (e-mail and password); sessions hold only the user's id.
import { RequestContext } from '@mikro-orm/core';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Request } from 'express';
import { signedInUser } from '../http/request-identity';
import { User } from './user.entity';
import { burnVerifyTime, verifyPassword } from './passwords';

export type AppPassport = InstanceType<typeof Passport>;

export function createPassport(): AppPassport {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const em = RequestContext.getEntityManager()!;
        const user = await em.findOne(User, { email: email.trim().toLowerCase() });
        if (!user) {
          await burnVerifyTime(password);
          done(null, false);
          return;
        }
        done(null, (await verifyPassword(user.passwordHash, password)) ? user : false);
      } catch (error) {
        done(error);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // Every signed-in request reads its user (on a build's route with the membership the guard needs: one query).
  passport.deserializeUser((req: Request, id: string, done: (error: unknown, user?: User | false) => void) => {
    signedInUser(req, id).then((user) => done(null, user ?? false), done);
  });
  return passport;
}

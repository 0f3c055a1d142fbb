// Passport with a local strategy (e-mail and password); sessions hold only the user's id.
import { RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
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
  // Every signed-in request reads its user: one plain query mapped to the entity. findOne's query building and
  // populate planning cost about four times the query itself, on every request (`npm run bench`, list routes).
  passport.deserializeUser(async (id: string, done) => {
    try {
      const em = RequestContext.getEntityManager() as EntityManager;
      const [row] = await em.execute('select * from app_user where id = ?', [id]);
      done(null, row ? em.map(User, row) : false);
    } catch (error) {
      done(error);
    }
  });
  return passport;
}

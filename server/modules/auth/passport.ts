import passport from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import type { Db } from '../../db/client'
import { findUserById } from '../users/users.repo'
import { checkCredentials, toSessionUser } from './auth.service'

/** One Passport instance per app (keeps tests isolated). The session holds the user id only. */
export function configurePassport(db: Db): passport.PassportStatic {
  const p = new passport.Passport() as unknown as passport.PassportStatic
  p.use(
    new LocalStrategy({ usernameField: 'email' }, (email, password, done) => {
      // a right password on an unconfirmed address fails with a reason the route can tell
      checkCredentials(db, email, password).then(
        (found) => (found && 'user' in found ? done(null, found.user) : done(null, false, { message: found ? 'unconfirmed' : 'invalid' })),
        done,
      )
    }),
  )
  p.serializeUser((user, done) => done(null, user.id))
  p.deserializeUser((id: string, done) => {
    findUserById(db, id).then(
      (u) => done(null, u && u.active ? toSessionUser(u) : false),
      done,
    )
  })
  return p
}

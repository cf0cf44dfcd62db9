import { sql } from 'drizzle-orm'
import { boolean, check, index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { ROLES, STAFF_ROLES } from '../../../shared/domain/roles'
import { offices } from './offices'
import { sqlList } from './sql-list'

export const PASSWORD_TOKEN_PURPOSES = ['reset', 'invite', 'confirm'] as const
export const ACCOUNT_MAIL_KINDS = ['register', 'reset'] as const

/**
 * People who sign in. Roles are text with a CHECK rather than a pg enum, so that a later
 * migration can add a role without the one-transaction enum trap of the migrator.
 */
export const users = pgTable(
  'users',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: text('email').notNull().unique(),
    name: text('name').notNull(),
    role: text('role', { enum: ROLES }).notNull(),
    officeId: uuid('office_id').references(() => offices.id, { onDelete: 'restrict' }),
    /** argon2id; null until an invited staff member sets a password. */
    passwordHash: text('password_hash'),
    active: boolean('active').notNull().default(true),
    /**
     * When the owner proved the address by following an e-mailed link. Self-registered
     * complainants start with null and cannot sign in until then; staff accounts (vouched for
     * by an administrator) and accounts from before confirmation existed count as confirmed
     * from their creation, which is what the default gives them.
     */
    emailConfirmedAt: timestamp('email_confirmed_at', { withTimezone: true }).defaultNow(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    /** The last successful sign-in (password, confirmation link or set-password link); null until the first. */
    lastSignedInAt: timestamp('last_signed_in_at', { withTimezone: true }),
  },
  (t) => [
    check('users_role_valid', sql`${t.role} in ${sqlList(ROLES)}`),
    check('users_staff_have_office', sql`${t.role} not in ${sqlList(STAFF_ROLES)} or ${t.officeId} is not null`),
    check('users_email_lowercase', sql`${t.email} = lower(${t.email})`),
    index('users_office_idx').on(t.officeId),
  ],
)

export type User = typeof users.$inferSelect

/**
 * Single-use tokens for password reset, staff invitation and e-mail confirmation; only the
 * SHA-256 hash is stored.
 */
export const passwordTokens = pgTable(
  'password_tokens',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    purpose: text('purpose', { enum: PASSWORD_TOKEN_PURPOSES }).notNull(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check('password_tokens_purpose_valid', sql`${t.purpose} in ${sqlList(PASSWORD_TOKEN_PURPOSES)}`)],
)

/**
 * E-mails sent in answer to anonymous account requests (registration, password reset), per
 * recipient address, whether or not the address has an account: what caps the mails one
 * address receives in an hour, and what lets both answers take the same path.
 */
export const accountMails = pgTable(
  'account_mails',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: text('email').notNull(),
    kind: text('kind', { enum: ACCOUNT_MAIL_KINDS }).notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check('account_mails_kind_valid', sql`${t.kind} in ${sqlList(ACCOUNT_MAIL_KINDS)}`), index('account_mails_email_at_idx').on(t.email, t.at)],
)

/** Sign-in attempts, for per-account and per-address limits that hold across app processes. */
export const signInAttempts = pgTable(
  'sign_in_attempts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: text('email').notNull(),
    ip: text('ip').notNull(),
    succeeded: boolean('succeeded').notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('sign_in_attempts_email_at_idx').on(t.email, t.at), index('sign_in_attempts_ip_at_idx').on(t.ip, t.at)],
)

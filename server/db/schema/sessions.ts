import { index, json, pgTable, timestamp, varchar } from 'drizzle-orm/pg-core'

/** Session store table of connect-pg-simple, owned by our migrations (same shape as its table.sql). */
export const session = pgTable(
  'session',
  {
    sid: varchar('sid').primaryKey(),
    sess: json('sess').notNull(),
    expire: timestamp('expire', { precision: 6 }).notNull(),
  },
  (t) => [index('IDX_session_expire').on(t.expire)],
)

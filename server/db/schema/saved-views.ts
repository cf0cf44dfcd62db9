import { sql } from 'drizzle-orm'
import { check, index, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core'
import { users } from './users'

/**
 * A member of staff's saved views of the case list: a name and the list's query string (the
 * page's own URL search, filters and sort), so a view opens as the list itself would write it.
 * Each person sees and keeps only their own.
 */
export const savedViews = pgTable(
  'saved_views',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    listQuery: text('list_query').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('saved_views_user_name').on(t.userId, t.name),
    index('saved_views_user_idx').on(t.userId),
    check('saved_views_name_length', sql`char_length(${t.name}) between 1 and 80`),
    check('saved_views_query_length', sql`char_length(${t.listQuery}) <= 2000`),
  ],
)

export type SavedView = typeof savedViews.$inferSelect

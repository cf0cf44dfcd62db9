import type pg from 'pg'
import type PgBoss from 'pg-boss'
import type { Db } from './db/client'
import type { MailQueueOptions } from './jobs/boss'

/** What services need from the outside world; built once by createApp. */
export interface ServiceContext {
  pool: pg.Pool
  db: Db
  boss: PgBoss
  publicUrl: string
  mailQueue: MailQueueOptions
  /** The time a change happens at. Real time in the app; a story's clock when the demo is seeded. */
  now(): Date
}

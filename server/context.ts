import type pg from 'pg'
import type PgBoss from 'pg-boss'
import type { Db } from './db/client'
import type { MailQueueOptions } from './jobs/boss'
import type { ObjectStore } from './storage/object-store'
import type { CaseFileSigner } from './modules/case-file/case-file-signing'

/** What services need from the outside world; built once by createApp. */
export interface ServiceContext {
  pool: pg.Pool
  db: Db
  boss: PgBoss
  publicUrl: string
  mailQueue: MailQueueOptions
  /** The file store (S3); absent, storing or reading a file answers 503 storage_unavailable. */
  objectStore?: ObjectStore
  /** The office's case-file signer (made on first use for a demo one); absent, case files answer 503. */
  caseFileSigner?: () => CaseFileSigner | undefined
  /** The time a change happens at. Real time in the app; a story's clock when the demo is seeded. */
  now(): Date
}

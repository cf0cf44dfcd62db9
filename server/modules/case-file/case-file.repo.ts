/**
 * The queries of the case file: how many case files a case has had (for the next file's
 * number). The "issued" entry itself goes through the cases module's appendEvent. No
 * authorization here.
 */
import { and, count, eq } from 'drizzle-orm'
import { CASE_FILE_ISSUED_KIND } from '../../../shared/domain/timeline-titles'
import type { Db } from '../../db/client'
import { caseEvents } from '../../db/schema'

/** The number of case files issued for the case so far (its timeline's "issued" entries). */
export async function countIssuedCaseFiles(db: Db, caseId: string): Promise<number> {
  const [r] = await db
    .select({ n: count() })
    .from(caseEvents)
    .where(and(eq(caseEvents.caseId, caseId), eq(caseEvents.kind, CASE_FILE_ISSUED_KIND)))
  return r!.n
}

/**
 * The retention_actions rows a retention run's plan of one case stands for, in the order the
 * run writes them: the tests compare a dry run's plan, mapped through this, with the rows the
 * real run then records (the dry run lists exactly what the real run removes).
 */
import type pg from 'pg'
import { expect } from 'vitest'
import type { RetentionPlanCase } from '../../shared/schemas/retention'

export interface RecordedAction {
  action: string
  stage: string | null
  evidence_id: string | null
  object_key: string | null
  redacted_event_ids: number[] | null
  details: unknown
}

const row = (r: Partial<RecordedAction> & { action: string }): RecordedAction => ({ stage: null, evidence_id: null, object_key: null, redacted_event_ids: null, details: null, ...r })

/** The rows the plan stands for once every object deletion has finished ('pending' rows, then 'done' rows). */
export function actionsOfPlan(plan: RetentionPlanCase): RecordedAction[] {
  const rows: RecordedAction[] = []
  if (plan.fields.length > 0) rows.push(row({ action: 'personal_data_erased', redacted_event_ids: plan.redactedEventIds }))
  if (plan.coarsePosition) rows.push(row({ action: 'location_coarsened', details: { positionStepDeg: 0.01 } }))
  if (plan.mergeEventIds.length > 0) rows.push(row({ action: 'merge_entries_redacted', redacted_event_ids: plan.mergeEventIds }))
  if (plan.fileNames.length > 0) rows.push(row({ action: 'file_names_erased', details: { files: plan.fileNames } }))
  if (plan.queuedMails.length > 0) rows.push(row({ action: 'queued_mail_cancelled', details: { count: plan.queuedMails.length, jobIds: plan.queuedMails.map((m) => m.jobId) } }))
  if (plan.account?.outcome === 'deactivated') rows.push(row({ action: 'account_deactivated', details: { userId: plan.account.userId, sessionsEnded: expect.any(Number) } }))
  const objects = plan.evidence.flatMap((e) => [
    { action: 'evidence_disposed', evidence_id: e.evidenceId, object_key: e.objectKey },
    ...(e.thumbnailKey ? [{ action: 'thumbnail_disposed', evidence_id: e.evidenceId, object_key: e.thumbnailKey }] : []),
  ])
  for (const o of objects) rows.push(row({ ...o, stage: 'pending' }))
  for (const o of objects) rows.push(row({ ...o, stage: 'done' }))
  return rows
}

/** The rows recorded for a case, oldest first, in the shape actionsOfPlan answers. */
export async function recordedActions(pool: pg.Pool, caseId: string): Promise<RecordedAction[]> {
  const { rows } = await pool.query<RecordedAction>(
    `SELECT action, stage, evidence_id, object_key, redacted_event_ids, details FROM retention_actions WHERE case_id = $1 ORDER BY id`,
    [caseId],
  )
  return rows
}

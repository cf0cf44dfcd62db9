/**
 * The queries of the processing sweep (processing-sweep.ts): evidence files whose background
 * work was never queued, or whose job is gone. A job is live while pg-boss holds it as created,
 * retry, or active and not yet past its expiry.
 */
import { sql } from 'drizzle-orm'
import { PROCESSED_EVIDENCE_KINDS, THUMBNAIL_SOURCE_TYPES, type EvidenceKind } from '../../../shared/domain/evidence'
import type { Db } from '../../db/client'
import { JOB_QUEUE_SCHEMA } from '../../db/roles'

export interface StrandedFile {
  id: string
  caseId: string
  kind: EvidenceKind
  displayName: string
}

const liveJob = (queue: string, task: 'analysis' | 'thumbnail', expireSeconds: number) => sql`
  exists (
    select 1 from ${sql.identifier(JOB_QUEUE_SCHEMA)}.job j
    where j.name = ${queue} and j.data->>'evidenceId' = e.id::text
      and ${task === 'thumbnail' ? sql`j.data->>'task' = 'thumbnail'` : sql`j.data->>'task' is null`}
      and (j.state in ('created', 'retry') or (j.state = 'active' and j.started_on > now() - make_interval(secs => ${expireSeconds})))
  )`

/**
 * Files of a processed kind, not removed, uploaded before `uploadedBefore`, that are not a
 * `.sigmf-meta` (its analysis is its dataset's) and have no analysis row, or one still queued
 * or running for longer than `expireSeconds` with no live job.
 */
export async function filesWithStrandedAnalysis(db: Db, opts: { uploadedBefore: Date; expireSeconds: number; queue: string; limit: number }): Promise<StrandedFile[]> {
  const kinds = sql.join(PROCESSED_EVIDENCE_KINDS.map((k) => sql`${k}`), sql`, `)
  const r = await db.execute<{ id: string; case_id: string; kind: EvidenceKind; display_name: string }>(sql`
    select e.id, e.case_id, e.kind, e.display_name
    from evidence_files e
    left join evidence_analyses a on a.evidence_id = e.id
    where e.removed_at is null and e.kind in (${kinds}) and e.uploaded_at < ${opts.uploadedBefore.toISOString()}
      and lower(e.display_name) not like '%.sigmf-meta'
      and (a.evidence_id is null
        or (a.state in ('queued', 'running') and a.updated_at < now() - make_interval(secs => ${opts.expireSeconds}) and not ${liveJob(opts.queue, 'analysis', opts.expireSeconds)}))
    order by e.uploaded_at
    limit ${opts.limit}`)
  return r.rows.map((x) => ({ id: x.id, caseId: x.case_id, kind: x.kind, displayName: x.display_name }))
}

/** Images (by their sniffed type), not removed, uploaded before `uploadedBefore`, with no thumbnail row and no live thumbnail job. */
export async function imagesWithoutThumbnail(db: Db, opts: { uploadedBefore: Date; expireSeconds: number; queue: string; limit: number }): Promise<string[]> {
  const types = sql.join(THUMBNAIL_SOURCE_TYPES.map((t) => sql`${t}`), sql`, `)
  const r = await db.execute<{ id: string }>(sql`
    select e.id
    from evidence_files e
    join stored_files f on f.id = e.stored_file_id
    left join evidence_thumbnails th on th.evidence_id = e.id
    where e.removed_at is null and f.content_type in (${types}) and e.uploaded_at < ${opts.uploadedBefore.toISOString()}
      and th.evidence_id is null and not ${liveJob(opts.queue, 'thumbnail', opts.expireSeconds)}
    order by e.uploaded_at
    limit ${opts.limit}`)
  return r.rows.map((x) => x.id)
}

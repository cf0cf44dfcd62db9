/**
 * Evidence files on a case (/api/cases/:id/evidence, /api/track/:token/evidence,
 * /api/my/reports/:id/evidence, /api/evidence/:id/…): the answers. A file's type is decided by
 * the server from its content; sizes are bytes, hashes SHA-256 in lowercase hex.
 */
import { z } from 'zod'
import {
  CUSTODY_ACTIONS,
  EVIDENCE_KINDS,
  EVIDENCE_PROCESSING_STATES,
  EVIDENCE_UPLOADER_ROLES,
  VERIFICATION_OUTCOMES,
} from '../domain/evidence'
import { trackingTokenParamSchema } from './cases'
import { idParamSchema, idSchema } from './ids'
import { storableString } from './text'

const instant = z.iso.datetime()
const id = z.uuid()

export const evidenceKindSchema = z.enum(EVIDENCE_KINDS)

export const evidenceProcessingSchema = z.object({
  state: z.enum(EVIDENCE_PROCESSING_STATES),
  progress: z.number().min(0).max(1),
  message: z.string().optional(),
})

export const evidenceAbilitiesSchema = z.object({
  download: z.boolean(),
  verify: z.boolean(),
  remove: z.boolean(),
  /** Share the staff file with the complainant, or stop sharing it (POST /api/evidence/:id/share); always sent by the server. */
  share: z.boolean().optional(),
})
export type EvidenceAbilities = z.infer<typeof evidenceAbilitiesSchema>

export const evidenceViewSchema = z.object({
  id,
  caseId: id,
  kind: evidenceKindSchema,
  /** The file's name as uploaded, cleaned of path separators and control characters. */
  originalName: z.string(),
  sizeBytes: z.number().int().min(1),
  /** Decided from the content, never from the uploader's declaration. */
  contentType: z.string(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  uploadedBy: z.object({
    id: id.nullable(),
    name: z.string(),
    role: z.enum(EVIDENCE_UPLOADER_ROLES),
  }),
  uploadedAt: instant,
  removed: z.object({ at: instant, by: z.string(), reason: z.string() }).nullable(),
  verification: z.object({ at: instant, by: z.string(), outcome: z.enum(VERIFICATION_OUTCOMES) }).nullable(),
  processing: evidenceProcessingSchema,
  /**
   * A photo's thumbnail (GET /api/evidence/:id/thumbnail): being made, made (its size in pixels),
   * or refused with the reason; null or absent for a file that gets none.
   */
  thumbnail: z
    .discriminatedUnion('state', [
      z.object({ state: z.literal('pending') }),
      z.object({ state: z.literal('done'), widthPx: z.number().int().min(1), heightPx: z.number().int().min(1) }),
      z.object({ state: z.literal('failed'), message: z.string() }),
    ])
    .nullable()
    .optional(),
  /**
   * Whether the complainant sees the file: their own uploads, and staff files the office shared
   * with them (then `uploadedBy.role` is 'staff'). Always sent by the server.
   */
  sharedWithComplainant: z.boolean().optional(),
  abilities: evidenceAbilitiesSchema,
})
export type EvidenceView = z.infer<typeof evidenceViewSchema>

export const evidenceListResponseSchema = z.object({ evidence: z.array(evidenceViewSchema) })
export type EvidenceListResponse = z.infer<typeof evidenceListResponseSchema>

export const evidenceUploadResponseSchema = z.object({ evidence: evidenceViewSchema })

export const custodyEntryViewSchema = z.object({
  at: instant,
  /** A staff name, 'Complainant', or 'Quietband' for automatic steps. */
  actor: z.string(),
  action: z.enum(CUSTODY_ACTIONS),
  /** The client's address as the server saw it. */
  from: z.string().nullable(),
  detail: z.string().optional(),
})
export type CustodyEntryView = z.infer<typeof custodyEntryViewSchema>

export const custodyListResponseSchema = z.object({ custody: z.array(custodyEntryViewSchema) })

export const verifyEvidenceResponseSchema = z.object({
  outcome: z.enum(VERIFICATION_OUTCOMES),
  expectedSha256: z.string(),
  actualSha256: z.string().nullable(),
  evidence: evidenceViewSchema,
})

/** The form fields sent beside the file (multipart). */
export const evidenceUploadFieldsSchema = z.strictObject({ kind: evidenceKindSchema })

export const removeEvidenceRequestSchema = z.strictObject({
  reason: storableString().trim().min(3, 'Say why the file is removed (at least 3 characters).').max(2000, 'A reason is at most 2000 characters.'),
})

/** POST /api/evidence/:id/share: share a staff file with the complainant (true) or stop (false). */
export const shareEvidenceRequestSchema = z.strictObject({
  shared: z.boolean({ error: 'Say whether the file is shared with the complainant (true or false).' }),
  note: storableString().trim().max(2000, 'A note is at most 2000 characters.').optional(),
})
export type ShareEvidenceRequest = z.infer<typeof shareEvidenceRequestSchema>

// ── path parameters of the complainant's routes ─────────────────────────────

/** GET /api/track/:token/evidence/:evidenceId/download (the evidence id: anything but a uuid is 404 evidence_not_found). */
export const trackedEvidenceParamSchema = trackingTokenParamSchema.extend({ evidenceId: idSchema })

/** GET /api/my/reports/:id/evidence/:evidenceId/download (either id not a uuid: 404). */
export const reportEvidenceParamSchema = idParamSchema.extend({ evidenceId: idSchema })

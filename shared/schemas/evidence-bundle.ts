/**
 * The manifest inside a case's evidence bundle (GET /api/cases/:id/evidence-bundle, a ZIP):
 * `manifest.json` lists every file with the SHA-256 taken at intake and the outcome of hashing
 * it again while it was written into the ZIP, its uploader, times and custody log.
 */
import { z } from 'zod'
import { CUSTODY_ACTIONS, EVIDENCE_KINDS, EVIDENCE_UPLOADER_ROLES } from '../domain/evidence'

const instant = z.iso.datetime()
const sha256 = z.string().regex(/^[0-9a-f]{64}$/)

/** match: the bundled bytes hash to the intake value; mismatch: they do not; unreadable: the store could not give the file (left out). */
export const BUNDLE_CHECK_OUTCOMES = ['match', 'mismatch', 'unreadable'] as const

export const bundleManifestFileSchema = z.object({
  /** Where the file sits inside the ZIP; null when it could not be read from the store. */
  path: z.string().nullable(),
  evidenceId: z.uuid(),
  name: z.string(),
  kind: z.enum(EVIDENCE_KINDS),
  sizeBytes: z.number().int().min(0),
  contentType: z.string(),
  /** The SHA-256 taken when the file was received. */
  sha256,
  uploadedBy: z.object({ name: z.string(), role: z.enum(EVIDENCE_UPLOADER_ROLES) }),
  uploadedAt: instant,
  check: z.object({ outcome: z.enum(BUNDLE_CHECK_OUTCOMES), computedSha256: sha256.nullable(), bytesRead: z.number().int().min(0) }),
  /** The file's custody log up to this bundle (the bundle's own entry is written as it is made). */
  custody: z.array(z.object({ at: instant, actor: z.string(), action: z.enum(CUSTODY_ACTIONS), from: z.string().nullable(), detail: z.string().nullable() })),
})

export const bundleManifestSchema = z.object({
  format: z.literal('quietband-evidence-bundle'),
  formatVersion: z.literal(1),
  case: z.object({ id: z.uuid(), reference: z.string() }),
  createdAt: instant,
  createdBy: z.string(),
  hashAlgorithm: z.literal('SHA-256'),
  files: z.array(bundleManifestFileSchema),
})

export type BundleManifest = z.infer<typeof bundleManifestSchema>
export type ManifestFile = z.infer<typeof bundleManifestFileSchema>
export type BundleCheck = (typeof BUNDLE_CHECK_OUTCOMES)[number]

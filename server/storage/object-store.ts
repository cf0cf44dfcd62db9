/**
 * The object store the app keeps files in (S3-compatible; the local fake in development), and
 * how big an upload may be. Built once from the configuration (server/main.ts) and handed to
 * createApp; absent, every route that stores or reads a file answers 503 storage_unavailable.
 */
import type { S3Client } from '@aws-sdk/client-s3'
import type { Env } from '../config/env'
import { createS3Client, type S3Settings } from './s3'

export interface ObjectStore {
  client: S3Client
  bucket: string
  /** The largest file an upload may hold [bytes] (UPLOAD_MAX_BYTES). */
  maxUploadBytes: number
  /** The largest evidence file each kind of uploader may put on a case [bytes] (EVIDENCE_MAX_BYTES_*); absent, the defaults of the evidence module. */
  evidenceMaxBytes?: EvidenceMaxBytes
  /** Files a complainant may add to one case in an hour (EVIDENCE_COMPLAINANT_FILES_PER_HOUR); absent, the evidence module's default. */
  evidenceComplainantFilesPerHour?: number
}

export interface EvidenceMaxBytes {
  staff: number
  complainant: number
}

export function createObjectStore(settings: S3Settings & { maxUploadBytes: number; evidenceMaxBytes?: EvidenceMaxBytes; evidenceComplainantFilesPerHour?: number }): ObjectStore {
  return {
    client: createS3Client(settings),
    bucket: settings.bucket,
    maxUploadBytes: settings.maxUploadBytes,
    evidenceMaxBytes: settings.evidenceMaxBytes,
    evidenceComplainantFilesPerHour: settings.evidenceComplainantFilesPerHour,
  }
}

/** The store the configuration names (S3_* and UPLOAD_MAX_BYTES). */
export function objectStoreFromEnv(env: Env): ObjectStore {
  return createObjectStore({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    bucket: env.S3_BUCKET,
    accessKeyId: env.S3_ACCESS_KEY_ID,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    maxUploadBytes: env.UPLOAD_MAX_BYTES,
    evidenceMaxBytes: { staff: env.EVIDENCE_MAX_BYTES_STAFF, complainant: env.EVIDENCE_MAX_BYTES_COMPLAINANT },
    evidenceComplainantFilesPerHour: env.EVIDENCE_COMPLAINANT_FILES_PER_HOUR,
  })
}

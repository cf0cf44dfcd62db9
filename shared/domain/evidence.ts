/**
 * Evidence files on a case: what kind of file it is (chosen by the uploader), the steps of its
 * chain of custody and the states of its background processing. Labels live beside the lists.
 */
export const EVIDENCE_KINDS = ['spectrum_capture', 'iq_recording', 'photo', 'document', 'audio', 'other'] as const
export type EvidenceKind = (typeof EVIDENCE_KINDS)[number]

export const EVIDENCE_KIND_LABELS: Record<EvidenceKind, string> = {
  spectrum_capture: 'Spectrum capture',
  iq_recording: 'I/Q recording',
  photo: 'Photo',
  document: 'Document',
  audio: 'Audio recording',
  other: 'Other file',
}

/** Who put a file on the case. */
export const EVIDENCE_UPLOADER_ROLES = ['staff', 'complainant'] as const
export type EvidenceUploaderRole = (typeof EVIDENCE_UPLOADER_ROLES)[number]

/** Each step of a file's chain of custody; the log is append-only. */
export const CUSTODY_ACTIONS = ['uploaded', 'downloaded', 'verified', 'verification_failed', 'removed', 'bundled', 'shared_with_complainant', 'sharing_stopped'] as const
export type CustodyAction = (typeof CUSTODY_ACTIONS)[number]

export const CUSTODY_ACTION_LABELS: Record<CustodyAction, string> = {
  uploaded: 'Uploaded',
  downloaded: 'Downloaded',
  verified: 'Integrity verified',
  verification_failed: 'Integrity check failed',
  removed: 'Removed from the case',
  bundled: 'Included in an evidence bundle',
  shared_with_complainant: 'Shared with the complainant',
  sharing_stopped: 'No longer shared with the complainant',
}

export const VERIFICATION_OUTCOMES = ['verified', 'failed'] as const
export type VerificationOutcome = (typeof VERIFICATION_OUTCOMES)[number]

/** Background processing of a file (spectrum captures and recordings are read after upload). */
export const EVIDENCE_PROCESSING_STATES = ['none', 'queued', 'running', 'done', 'failed'] as const
export type EvidenceProcessingState = (typeof EVIDENCE_PROCESSING_STATES)[number]

export const EVIDENCE_PROCESSING_STATE_LABELS: Record<EvidenceProcessingState, string> = {
  none: 'Not processed',
  queued: 'Waiting to be processed',
  running: 'Processing',
  done: 'Processed',
  failed: 'Processing failed',
}

/** The kinds read by the background processing after upload (the others stay 'none'). */
export const PROCESSED_EVIDENCE_KINDS: readonly EvidenceKind[] = ['spectrum_capture', 'iq_recording']

/** The processing state kept on the file's row (jsonb), updated by the processing job. */
export interface EvidenceProcessing {
  state: EvidenceProcessingState
  /** 0 to 1. */
  progress: number
  message?: string
}

/** How an image's thumbnail ended (server/modules/evidence/thumbnails): made, or refused with a reason. */
export const THUMBNAIL_STATES = ['done', 'failed'] as const
export type ThumbnailState = (typeof THUMBNAIL_STATES)[number]

/** The image types (as decided from the content) that get a thumbnail. */
export const THUMBNAIL_SOURCE_TYPES: readonly string[] = ['image/jpeg', 'image/png', 'image/webp']

/** Evidence files on a case, as the API document describes them (routes: evidence.routes.ts). */
import {
  custodyListResponseSchema,
  evidenceListResponseSchema,
  evidenceUploadFieldsSchema,
  evidenceUploadResponseSchema,
  removeEvidenceRequestSchema,
  reportEvidenceParamSchema,
  shareEvidenceRequestSchema,
  trackedEvidenceParamSchema,
  verifyEvidenceResponseSchema,
} from '../../../shared/schemas/evidence'
import { trackingTokenParamSchema } from '../../../shared/schemas/cases'
import { idParamSchema } from '../../../shared/schemas/ids'
import { EVERYONE, type ApiOperation, type Caller, type RawAnswer } from '../../openapi/operation'
import { THUMBNAIL_CONTENT_TYPE } from './thumbnails/make-thumbnail'

const tag = 'Evidence'
/** Staff of the case's office (an administrator manages accounts, not casework). */
const CASE_STAFF: readonly Caller[] = ['investigator', 'supervisor']
const COMPLAINANT: readonly Caller[] = ['complainant']

/** The `kind` field first (the content is judged by it), then the file. */
const upload = { multipart: evidenceUploadFieldsSchema, files: ['file'] } as const
const download: RawAnswer = {
  // any type: the file is sent with the type decided from its content at intake
  contentType: '*/*',
  description:
    'The file\'s bytes, streamed as an attachment with the type decided from its content at intake (never sniffed, never cached); the header X-Evidence-SHA256 carries the SHA-256 taken at intake.',
}
const uploadWords = 'The file\'s type is decided from its content (415 when it is not accepted); 413 beyond the uploader\'s size limit; 503 when the file store cannot take it.'
const complainantUploadWords = `${uploadWords} A closed report takes no more files (409 case_closed), and a report takes only so many files an hour from its complainant (429).`

const DOWNLOAD_WORDS = 'Each download is a custody entry. A file deleted when the retention period ended answers 410 evidence_disposed; one whose stored copy is missing from the store, 404 stored_object_missing.'

export const evidenceApi: ApiOperation[] = [
  {
    method: 'post',
    path: '/api/cases/:id/evidence',
    summary: 'Add a file to a case (staff of its office)',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    body: upload,
    responses: { 201: evidenceUploadResponseSchema },
    errors: [413, 415, 503],
    description: `${uploadWords} The upload is the first entry of the file's chain of custody.`,
  },
  {
    method: 'get',
    path: '/api/cases/:id/evidence',
    summary: 'A case\'s files, removed ones marked, with their processing and what the caller may do with each',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    responses: { 200: evidenceListResponseSchema },
  },
  {
    method: 'post',
    path: '/api/track/:token/evidence',
    summary: 'The complainant adds a file to their report through its tracking link',
    tag,
    callers: EVERYONE,
    params: trackingTokenParamSchema,
    body: upload,
    responses: { 201: evidenceUploadResponseSchema },
    errors: [409, 413, 415, 429, 503],
    description: `${complainantUploadWords} Too many tracking links that do not open from one address: 429.`,
  },
  {
    method: 'get',
    path: '/api/track/:token/evidence',
    summary: 'The files a complainant sees through the tracking link: their own uploads and files the office shared',
    tag,
    callers: EVERYONE,
    params: trackingTokenParamSchema,
    responses: { 200: evidenceListResponseSchema },
    errors: [429],
  },
  {
    method: 'get',
    path: '/api/track/:token/evidence/:evidenceId/download',
    summary: 'The complainant downloads a file the office shared with them, through the tracking link',
    tag,
    callers: EVERYONE,
    params: trackedEvidenceParamSchema,
    responses: { 200: download },
    errors: [410, 429, 503],
    description: DOWNLOAD_WORDS,
  },
  {
    method: 'get',
    path: '/api/my/reports/:id/evidence/:evidenceId/download',
    summary: 'A signed-in complainant downloads a file the office shared with them',
    tag,
    callers: COMPLAINANT,
    params: reportEvidenceParamSchema,
    responses: { 200: download },
    errors: [410, 503],
    description: DOWNLOAD_WORDS,
  },
  {
    method: 'post',
    path: '/api/my/reports/:id/evidence',
    summary: 'A signed-in complainant adds a file to one of their reports',
    tag,
    callers: COMPLAINANT,
    params: idParamSchema,
    body: upload,
    responses: { 201: evidenceUploadResponseSchema },
    errors: [409, 413, 415, 429, 503],
    description: complainantUploadWords,
  },
  {
    method: 'get',
    path: '/api/my/reports/:id/evidence',
    summary: 'The files a signed-in complainant sees on one of their reports',
    tag,
    callers: COMPLAINANT,
    params: idParamSchema,
    responses: { 200: evidenceListResponseSchema },
  },
  {
    method: 'get',
    path: '/api/evidence/:id/download',
    summary: 'Download an evidence file (staff of its office)',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    responses: { 200: download },
    errors: [410, 503],
    description: DOWNLOAD_WORDS,
  },
  {
    method: 'post',
    path: '/api/evidence/:id/share',
    summary: 'Share one of the office\'s own files with the complainant, or stop sharing it',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    body: shareEvidenceRequestSchema,
    responses: { 200: evidenceUploadResponseSchema },
    errors: [409],
    description: 'A complainant\'s own upload, a removed file or one deleted at the end of the retention period cannot be shared (409). Each change is a custody entry.',
  },
  {
    method: 'post',
    path: '/api/evidence/:id/verify',
    summary: 'Hash a stored file again and compare it with the SHA-256 taken at intake',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    responses: { 200: verifyEvidenceResponseSchema },
    errors: [503],
    description: 'The outcome is recorded on the file and in its chain of custody.',
  },
  {
    method: 'post',
    path: '/api/evidence/:id/remove',
    summary: 'Remove a file from a case, with the reason (the record and its custody log stay)',
    tag,
    callers: ['supervisor'],
    params: idParamSchema,
    body: removeEvidenceRequestSchema,
    responses: { 200: evidenceUploadResponseSchema },
    errors: [409],
    description: 'The office\'s supervisor. A file already removed: 409 evidence_already_removed.',
  },
  {
    method: 'get',
    path: '/api/evidence/:id/thumbnail',
    summary: 'A photo\'s thumbnail, for whoever may see the file',
    tag,
    callers: ['investigator', 'supervisor', 'complainant'],
    params: idParamSchema,
    responses: { 200: { contentType: THUMBNAIL_CONTENT_TYPE, description: 'A small rendition made by the server (not the evidence itself: no custody entry), kept privately by the browser for five minutes.' } },
    errors: [503],
    description: 'A file that is not a photo, or whose thumbnail is not made yet or could not be made: 404 thumbnail_not_found.',
  },
  {
    method: 'get',
    path: '/api/evidence/:id/custody',
    summary: 'A file\'s chain of custody: every upload, download, check, bundling, share and removal, oldest first',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    responses: { 200: custodyListResponseSchema },
  },
]

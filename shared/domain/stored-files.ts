/**
 * Files kept in the object store, each with a row saying what it is. A file's purpose says
 * which part of the product stored it and who may read it; new purposes (case evidence) join
 * this list.
 */
export const STORED_FILE_PURPOSES = ['station_register_import', 'evidence'] as const
export type StoredFilePurpose = (typeof STORED_FILE_PURPOSES)[number]

/**
 * Where a stored file's content type came from: the uploader's declaration (the multipart
 * header, or the seeder's) or sniffing of the content (evidence files: server/modules/evidence/content-check.ts).
 */
export const CONTENT_TYPE_SOURCES = ['declared', 'sniffed'] as const
export type ContentTypeSource = (typeof CONTENT_TYPE_SOURCES)[number]

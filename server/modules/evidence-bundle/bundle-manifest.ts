/**
 * What an evidence bundle says about itself: `manifest.json` (for programs) and `manifest.txt`
 * (for people), both written after every file has been streamed into the ZIP, so each file's
 * entry carries the SHA-256 recomputed from the bytes actually bundled beside the one taken at
 * intake.
 */
import { CUSTODY_ACTION_LABELS, EVIDENCE_KIND_LABELS } from '../../../shared/domain/evidence'
import type { BundleCheck, BundleManifest } from '../../../shared/schemas/evidence-bundle'

export type { BundleCheck, BundleManifest, ManifestFile } from '../../../shared/schemas/evidence-bundle'

const CHECK_WORDS: Record<BundleCheck, string> = {
  match: 'matches the hash taken at intake',
  mismatch: 'DOES NOT MATCH the hash taken at intake',
  unreadable: 'could not be read from the file store (not in this bundle)',
}

/** The same content as manifest.json, laid out for reading. */
export function manifestText(m: BundleManifest): string {
  const lines: string[] = [
    `Evidence bundle of case ${m.case.reference}`,
    `Made ${m.createdAt} by ${m.createdBy}. Hashes are ${m.hashAlgorithm}, lowercase hex.`,
    `${m.files.length} file(s). Each file was hashed again while it was written into this bundle.`,
    '',
  ]
  m.files.forEach((f, i) => {
    lines.push(
      `${i + 1}. ${f.name}`,
      `   in the bundle: ${f.path ?? '(missing)'}`,
      `   kind:          ${EVIDENCE_KIND_LABELS[f.kind]}`,
      `   size:          ${f.sizeBytes} bytes`,
      `   content type:  ${f.contentType}`,
      `   SHA-256:       ${f.sha256}`,
      `   check:         ${CHECK_WORDS[f.check.outcome]}${f.check.computedSha256 && f.check.outcome === 'mismatch' ? ` (bundled bytes: ${f.check.computedSha256}, ${f.check.bytesRead} bytes)` : ''}`,
      `   uploaded:      ${f.uploadedAt} by ${f.uploadedBy.name}${f.uploadedBy.role === 'complainant' ? ' (complainant)' : ''}`,
      '   custody:',
      ...f.custody.map((c) => `     ${c.at}  ${CUSTODY_ACTION_LABELS[c.action]} — ${c.actor}${c.from ? ` from ${c.from}` : ''}${c.detail ? ` (${c.detail})` : ''}`),
      '',
    )
  })
  return lines.join('\n')
}

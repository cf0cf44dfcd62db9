/**
 * What an evidence bundle says about itself: `manifest.json` (for programs) and `manifest.txt`
 * (for people), both written after every file has been streamed into the ZIP, so each file's
 * entry carries the SHA-256 recomputed from the bytes actually bundled beside the one taken at
 * intake.
 */
import { CUSTODY_ACTION_LABELS, EVIDENCE_KIND_LABELS } from '../../../shared/domain/evidence'
import type { BundleCheck, BundleManifest, ManifestFile } from '../../../shared/schemas/evidence-bundle'
import type { EvidenceCustodyRow } from '../../db/schema'
import type { BundledFileRow } from './evidence-bundle.repo'

export type { BundleCheck, BundleManifest, ManifestFile } from '../../../shared/schemas/evidence-bundle'

/** What the manifest says of a file before it is bundled: everything but its place in the ZIP and the check. */
export type ManifestEntry = Omit<ManifestFile, 'path' | 'check'>

/**
 * The manifest's entry for each kept evidence file (in the given order), with its custody log:
 * the evidence bundle adds each file's place and check, the case file prints them as they are.
 */
export function manifestEntries(files: readonly BundledFileRow[], custody: readonly EvidenceCustodyRow[]): ManifestEntry[] {
  return files.map((f) => ({
    evidenceId: f.evidenceId,
    name: f.displayName,
    kind: f.kind,
    sizeBytes: f.sizeBytes,
    contentType: f.contentType,
    sha256: f.sha256,
    uploadedBy: { name: f.uploaderName ?? 'Complainant', role: f.uploaderRole },
    uploadedAt: f.uploadedAt.toISOString(),
    custody: custody
      .filter((e) => e.evidenceId === f.evidenceId)
      .map((e) => ({ at: e.at.toISOString(), actor: e.actorLabel, action: e.action, from: e.clientAddress, detail: e.detail })),
  }))
}

/** A bundled file's manifest entry: the entry with its place in the ZIP and the check, in the manifest's key order. */
export function bundledFile(entry: ManifestEntry, path: string | null, check: ManifestFile['check']): ManifestFile {
  const { custody, ...rest } = entry
  return { path, ...rest, check, custody }
}

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

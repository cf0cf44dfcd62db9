/**
 * A case's evidence bundle: one ZIP streamed to the member of staff with every file still on
 * the case (read from the object store one after the other, never held whole) and a manifest
 * (`manifest.json`, `manifest.txt`) written last: names, sizes, SHA-256 taken at intake, kinds,
 * uploaders, times, the custody log, and the outcome of hashing each file again while it went
 * into the ZIP. Each bundled file gains a 'bundled' custody entry.
 */
import crypto from 'node:crypto'
import { Transform, type Readable, type TransformCallback, type Writable } from 'node:stream'
import { ZipArchive } from 'archiver'
import type { ServiceContext } from '../../context'
import type { CaseRow } from '../../db/schema'
import { log } from '../../log/logger'
import type { Actor } from '../../policy/policy'
import { readStoredObject, storageUnavailable } from '../../storage/stored-files'
import { HttpError } from '../../http/errors'
import { loadVisibleCase } from '../cases/case-access'
import { findUserById } from '../users/users.repo'
import { bundledFile, manifestEntries, manifestText, type BundleCheck, type BundleManifest, type ManifestFile } from './bundle-manifest'
import { appendCustody } from '../evidence/evidence.repo'
import { recordAudit } from '../audit/audit.repo'
import { custodyOfEvidence, keptEvidenceOfCase, type BundledFileRow } from './evidence-bundle.repo'

/** Passes bytes on unchanged while counting and hashing them. */
class HashTap extends Transform {
  readonly hash = crypto.createHash('sha256')
  bytes = 0
  override _transform(chunk: Buffer, _enc: BufferEncoding, cb: TransformCallback) {
    this.hash.update(chunk)
    this.bytes += chunk.length
    cb(null, chunk)
  }
}

/** A name that stays one file inside the ZIP on every system. */
export function zipSafeName(name: string): string {
  // eslint-disable-next-line no-control-regex
  const cleaned = name.replace(/[/\\\u0000-\u001f\u007f:*?"<>|]/g, '_').replace(/^\.+/, '_').trim()
  return cleaned.slice(0, 180) || 'unnamed'
}

export interface EvidenceBundle {
  /** The download's file name. */
  fileName: string
  /** Streams the ZIP into `out`; resolves once it is all written (or `out` went away). */
  write(out: Writable, clientAddress: string | null): Promise<void>
}

/** Checks who may have the bundle (staff of the case's office; another office's case is 404) and prepares it. */
export async function openEvidenceBundle(ctx: ServiceContext, actor: Actor, caseId: string): Promise<EvidenceBundle> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const files = await keptEvidenceOfCase(ctx.db, c.id)
  if (files.length > 0 && !ctx.objectStore) throw storageUnavailable('no file store is configured')
  // the first file is opened before anything is sent, so a store that is down is a plain 503
  // (a missing first object is not an outage: the bundle goes out with that file marked unreadable)
  const first =
    files.length > 0
      ? await readStoredObject(ctx.objectStore, files[0]!.objectKey).catch((e: unknown) => {
          if (e instanceof HttpError && e.code === 'stored_object_missing') return null
          throw e
        })
      : null
  const custody = await custodyOfEvidence(
    ctx.db,
    files.map((f) => f.evidenceId),
  )
  const me = await findUserById(ctx.db, actor.id)
  const actorLabel = me?.name ?? 'Staff'
  return {
    fileName: `${c.reference}-evidence.zip`,
    write: (out, clientAddress) => writeBundle(ctx, { c, files, custody, first, actorId: actor.id, actorLabel, out, clientAddress }),
  }
}

async function writeBundle(
  ctx: ServiceContext,
  o: {
    c: CaseRow
    files: BundledFileRow[]
    custody: Awaited<ReturnType<typeof custodyOfEvidence>>
    first: Readable | null
    actorId: string
    actorLabel: string
    out: Writable
    clientAddress: string | null
  },
): Promise<void> {
  const archive = new ZipArchive({ zlib: { level: 6 } })
  let gone = false
  o.out.on('close', () => {
    if (!o.out.writableFinished) {
      gone = true
      archive.abort()
    }
  })
  let archiveError: Error | null = null
  archive.on('error', (e) => {
    archiveError = e
  })
  archive.on('warning', (e) => log().warn(`evidence bundle of ${o.c.reference}: ${e.message}`))
  archive.pipe(o.out)

  const entries = manifestEntries(o.files, o.custody)
  const manifestFiles: ManifestFile[] = []
  const bundled: { evidenceId: string; outcome: BundleCheck }[] = []
  try {
    for (const [i, f] of o.files.entries()) {
      if (gone) break
      let body: Readable | null = i === 0 ? o.first : null
      if (!body) {
        try {
          body = await readStoredObject(ctx.objectStore, f.objectKey)
        } catch {
          body = null
        }
      }
      const path = `files/${String(i + 1).padStart(3, '0')}-${zipSafeName(f.displayName)}`
      let check: ManifestFile['check'] = { outcome: 'unreadable', computedSha256: null, bytesRead: 0 }
      if (body) {
        const tap = new HashTap()
        body.on('error', (e) => tap.destroy(e))
        const written = new Promise<void>((resolve, reject) => {
          archive.once('entry', () => resolve())
          tap.once('error', reject)
          archive.once('error', reject)
        })
        archive.append(body.pipe(tap), { name: path, date: f.uploadedAt })
        await written
        const computed = tap.hash.digest('hex')
        check = { outcome: computed === f.sha256 && tap.bytes === f.sizeBytes ? 'match' : 'mismatch', computedSha256: computed, bytesRead: tap.bytes }
        bundled.push({ evidenceId: f.evidenceId, outcome: check.outcome })
      }
      manifestFiles.push(bundledFile(entries[i]!, body ? path : null, check))
    }
    if (gone) return
    const manifest: BundleManifest = {
      format: 'quietband-evidence-bundle',
      formatVersion: 1,
      case: { id: o.c.id, reference: o.c.reference },
      createdAt: ctx.now().toISOString(),
      createdBy: o.actorLabel,
      hashAlgorithm: 'SHA-256',
      files: manifestFiles,
    }
    archive.append(`${JSON.stringify(manifest, null, 2)}\n`, { name: 'manifest.json' })
    archive.append(manifestText(manifest), { name: 'manifest.txt' })
    for (const b of bundled) {
      await appendCustody(ctx.db, {
        evidenceId: b.evidenceId,
        actorUserId: o.actorId,
        actorLabel: o.actorLabel,
        action: 'bundled',
        clientAddress: o.clientAddress,
        detail: `${o.c.reference}-evidence.zip; ${b.outcome === 'match' ? 'hash matched the one taken at intake' : 'hash DID NOT match the one taken at intake'}`,
      })
    }
    await recordAudit(ctx.db, {
      actorUserId: o.actorId,
      action: 'evidence.bundle_exported',
      targetType: 'case',
      targetId: o.c.id,
      officeId: o.c.officeId,
      details: { reference: o.c.reference, fileCount: bundled.length, hashMismatches: bundled.filter((b) => b.outcome !== 'match').length },
    })
    await archive.finalize()
    if (archiveError) throw archiveError
  } catch (e) {
    // the answer has begun: it can only be cut short, so the download is visibly incomplete
    log().error(`evidence bundle of ${o.c.reference} broke off: ${(e as Error)?.message ?? String(e)}`)
    archive.abort()
    o.out.destroy(e instanceof Error ? e : new Error(String(e)))
  }
}

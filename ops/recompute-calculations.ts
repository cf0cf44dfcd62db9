/**
 * Recomputes every stored calculation record with the current radio library and compares it
 * with what the record says:
 *
 *   node --import tsx ops/recompute-calculations.ts [--case <case id>]
 *
 * Reads MIGRATION_DATABASE_URL (the database owner), else DATABASE_URL. Each record is run again
 * from its stored inputs and its own reference copies (shared/calculations). Under the library
 * version the record was made with, any output differing by more than 1e-9 relative (or any
 * changed verdict, method id or other value), and any record that cannot be run again, is a
 * failure: the script lists them and exits 1. Records made with another library version are
 * listed with both versions and their differences, and do not fail the check.
 * Exit codes: 0 every record agrees, 1 a record under the same version differs, 2 bad usage.
 */
import { fileURLToPath } from 'node:url'
import { RADIO_LIBRARY_VERSION } from '../shared/radio'
import { idSchema } from '../shared/schemas/ids'
import type { RecomputeView } from '../shared/schemas/views'
import { createDb, createPool } from '../server/db/client'
import { calculationsPage } from '../server/modules/calculations/calculations.repo'
import { recomputeStored } from '../server/modules/calculations/recompute'
import { readOptions, usage, type OptionHelp } from './command-line'

const OPTIONS = {
  case: { type: 'string', value: 'ID', help: 'only the records of this case' },
} satisfies Record<string, OptionHelp>

const PAGE = 500

export interface RecomputeReport {
  checked: number
  /** Same library version, and a value differs (or the record cannot be run again). */
  failures: RecomputeView[]
  /** Another library version, with differences. */
  otherVersion: RecomputeView[]
}

/** Walks the records (all, or one case's) and recomputes each. */
export async function recomputeAll(databaseUrl: string, opts: { caseId?: string } = {}): Promise<RecomputeReport> {
  const pool = createPool(databaseUrl, 1)
  const report: RecomputeReport = { checked: 0, failures: [], otherVersion: [] }
  try {
    const db = createDb(pool)
    let afterId: string | undefined
    for (;;) {
      const page = await calculationsPage(db, { afterId, caseId: opts.caseId, limit: PAGE })
      for (const row of page) {
        const r = recomputeStored(row)
        report.checked += 1
        if (!r.differs) continue
        if (r.sameLibraryVersion) report.failures.push(r)
        else report.otherVersion.push(r)
      }
      if (page.length < PAGE) break
      afterId = page[page.length - 1]!.id
    }
  } finally {
    await pool.end()
  }
  return report
}

function describe(r: RecomputeView): string[] {
  const head = `${r.calculationId} ${r.kind}: stored with library ${r.storedLibraryVersion}, recomputed with ${r.currentLibraryVersion}`
  if (r.refused) return [head, `  cannot be run again: ${r.refused}`]
  const lines = r.differences
    .filter((d) => d.differs)
    .map((d) => `  ${d.path}: stored ${JSON.stringify(d.stored)}, now ${JSON.stringify(d.now)}${d.relativeDifference === null ? '' : ` (relative difference ${d.relativeDifference.toExponential(3)})`}`)
  return [head, ...lines]
}

async function main(): Promise<number> {
  let v
  try {
    v = readOptions(OPTIONS)
  } catch (e) {
    console.error(e instanceof Error ? e.message : e)
    return 2
  }
  if (v.help) {
    console.log(usage('node --import tsx ops/recompute-calculations.ts', OPTIONS))
    return 0
  }
  if (v.case !== undefined && !idSchema.safeParse(v.case).success) {
    console.error(`--case takes a case id (a uuid), not "${v.case}".`)
    return 2
  }
  const url = process.env.MIGRATION_DATABASE_URL ?? process.env.DATABASE_URL
  if (!url) {
    console.error('Set MIGRATION_DATABASE_URL (the database owner) or DATABASE_URL.')
    return 2
  }
  const r = await recomputeAll(url, { caseId: v.case })
  for (const f of r.failures) console.log(['DIFFERS under the same library version', ...describe(f)].join('\n'))
  for (const o of r.otherVersion) console.log(['differs under another library version', ...describe(o)].join('\n'))
  console.log(
    `${r.checked} record(s) recomputed with library ${RADIO_LIBRARY_VERSION}: ${r.failures.length} differ under their own version, ` +
      `${r.otherVersion.length} differ under another version.`,
  )
  return r.failures.length > 0 ? 1 : 0
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  main().then(
    (code) => process.exit(code),
    (e: unknown) => {
      console.error(e instanceof Error ? e.message : e)
      process.exit(1)
    },
  )
}

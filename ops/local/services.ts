/**
 * The embedded local services used when the environment names no real ones:
 * PostgreSQL (project-local cluster via ops/db.sh), an S3-compatible store (s3rver) and an
 * SMTP fake. Fills in the matching environment variables and returns how to stop what it
 * started. A variable that is set means a real service, and nothing is started for it.
 */
import { execFileSync } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import fs from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { startS3Fake } from './s3-fake'
import { startSmtpFake } from './smtp-fake'
import { ensureDemoP12 } from '../../server/modules/case-file/case-file-signing'

export const ROOT = fileURLToPath(new URL('../..', import.meta.url))
export const LOCAL_DIR = path.join(ROOT, '.local')
const DB_SCRIPT = path.join(ROOT, 'ops', 'db.sh')

/** A local service could not start for an expected reason; its message says what to do. */
export class LocalServiceError extends Error {}

export interface LocalServices {
  env: Record<string, string>
  started: string[]
  stop(): Promise<void>
}

function dbRunning(): boolean {
  try {
    execFileSync('bash', [DB_SCRIPT, 'status'], { stdio: 'ignore' })
    return true
  } catch {
    return false
  }
}

export async function ensureLocalServices(source: NodeJS.ProcessEnv = process.env): Promise<LocalServices> {
  fs.mkdirSync(LOCAL_DIR, { recursive: true })
  const env: Record<string, string> = {}
  const started: string[] = []
  const stops: Array<() => Promise<void>> = []

  if (!source.DATABASE_URL) {
    const wasRunning = dbRunning()
    let out: string
    try {
      out = execFileSync('bash', [DB_SCRIPT, 'start'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] })
    } catch {
      // ops/db.sh has said what happened and what to do on stderr
      throw new LocalServiceError('The project-local PostgreSQL did not start (see the message above).')
    }
    env.DATABASE_URL = /^DATABASE_URL=(\S+)/m.exec(out)![1]!
    // the owner role runs migrations and the demo seeding; the app runs as DATABASE_URL
    if (!source.MIGRATION_DATABASE_URL) env.MIGRATION_DATABASE_URL = /^MIGRATION_DATABASE_URL=(\S+)/m.exec(out)![1]!
    if (!wasRunning) {
      started.push(`PostgreSQL (project-local, ${new URL(env.DATABASE_URL).host})`)
      stops.push(async () => {
        execFileSync('bash', [DB_SCRIPT, 'stop'], { stdio: 'ignore' })
      })
    } else {
      started.push('PostgreSQL (already running, left running)')
    }
  }

  if (!source.S3_ENDPOINT && !source.S3_BUCKET) {
    const s3 = await startS3Fake({ directory: path.join(LOCAL_DIR, 's3'), bucket: 'quietband-evidence' })
    Object.assign(env, { S3_ENDPOINT: s3.endpoint, S3_BUCKET: s3.bucket, S3_ACCESS_KEY_ID: s3.accessKeyId, S3_SECRET_ACCESS_KEY: s3.secretAccessKey })
    started.push(`S3-compatible store (s3rver, ${s3.endpoint})`)
    stops.push(() => s3.close())
  }

  if (!source.SMTP_URL) {
    const mailDir = path.join(LOCAL_DIR, 'mail')
    const smtp = await startSmtpFake({ dir: mailDir })
    Object.assign(env, { SMTP_URL: smtp.url, DEV_MAILBOX_DIR: mailDir })
    started.push(`SMTP fake (${smtp.url}; messages in .local/mail)`)
    stops.push(() => smtp.close())
  }

  if (!source.SESSION_SECRET) env.SESSION_SECRET = sessionSecret()
  if (!source.CASE_FILE_P12_PATH && source.NODE_ENV !== 'production') {
    // case files are signed with a DEMO certificate generated once into a git-ignored file
    const demo = ensureDemoP12(path.join(LOCAL_DIR, 'case-file-demo.p12'))
    Object.assign(env, { CASE_FILE_P12_PATH: demo.path, CASE_FILE_P12_PASSPHRASE: demo.passphrase })
    started.push('DEMO case-file signing certificate (.local/case-file-demo.p12; not for legal use)')
  }

  return {
    env,
    started,
    async stop() {
      for (const s of stops.reverse()) await s().catch((e) => console.error('while stopping:', e))
    },
  }
}

/** A session secret generated on first start into a git-ignored file. */
function sessionSecret(): string {
  const file = path.join(LOCAL_DIR, 'session-secret')
  if (!fs.existsSync(file)) fs.writeFileSync(file, randomBytes(48).toString('base64url'), { mode: 0o600 })
  return fs.readFileSync(file, 'utf8').trim()
}

/** Loads .env when present (real services are configured there). */
export function loadDotEnv(): void {
  const file = path.join(ROOT, '.env')
  if (fs.existsSync(file)) process.loadEnvFile(file)
}

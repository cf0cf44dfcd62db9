/**
 * Configuration from environment variables, validated at start. A missing or invalid
 * variable stops the server with a message naming it. `npm start` (ops/start.ts) fills in
 * the embedded local services when a variable is unset; set it to use a real service.
 */
import { z } from 'zod'

const url = (what: string) => z.string({ message: `${what} is required` }).url({ message: `${what} must be a URL` })

/** True for an http(s) URL holding {z}, {x} and {y} (a tile URL template); {s} subdomains allowed. */
export function isTileUrlTemplate(v: string): boolean {
  if (!['{z}', '{x}', '{y}'].every((p) => v.includes(p))) return false
  try {
    const u = new URL(v.replace(/\{[a-z]+\}/g, '0'))
    return u.protocol === 'https:' || u.protocol === 'http:'
  } catch {
    return false
  }
}

/** The origin of a tile URL template (subdomain placeholder {s} kept as a wildcard, as CSP allows). */
export function tileOrigin(template: string): string {
  const u = new URL(template.replace(/\{s\}/g, 'tile-subdomain').replace(/\{[a-z]+\}/g, '0'))
  return `${u.protocol}//${u.host.replace('tile-subdomain', '*')}`
}

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  PUBLIC_URL: url('PUBLIC_URL'),
  DATABASE_URL: url('DATABASE_URL').refine((v) => /^postgres(ql)?:\/\//.test(v), 'DATABASE_URL must start with postgres://'),
  /** The owner role that runs migrations (default DATABASE_URL; then the timeline is not protected from the app). */
  MIGRATION_DATABASE_URL: url('MIGRATION_DATABASE_URL').refine((v) => /^postgres(ql)?:\/\//.test(v), 'MIGRATION_DATABASE_URL must start with postgres://').optional(),
  SESSION_SECRET: z.string({ message: 'SESSION_SECRET is required' }).min(32, 'SESSION_SECRET must be at least 32 characters'),
  S3_ENDPOINT: url('S3_ENDPOINT').optional(),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string({ message: 'S3_BUCKET is required' }).min(3),
  S3_ACCESS_KEY_ID: z.string({ message: 'S3_ACCESS_KEY_ID is required' }).min(1),
  S3_SECRET_ACCESS_KEY: z.string({ message: 'S3_SECRET_ACCESS_KEY is required' }).min(1),
  S3_FORCE_PATH_STYLE: z.enum(['true', 'false']).default('true').transform((v) => v === 'true'),
  /** The largest file an upload may hold, in bytes (default 50 MB). */
  UPLOAD_MAX_BYTES: z.coerce.number().int().min(1024).max(10 * 1024 ** 3).default(50 * 1024 * 1024),
  /** The largest evidence file a staff member may upload to a case [bytes] (default 2 GiB). */
  EVIDENCE_MAX_BYTES_STAFF: z.coerce.number().int().min(1024).max(50 * 1024 ** 3).default(2 * 1024 ** 3),
  /** The largest evidence file a complainant may upload to their report [bytes] (default 25 MiB). */
  EVIDENCE_MAX_BYTES_COMPLAINANT: z.coerce.number().int().min(1024).max(50 * 1024 ** 3).default(25 * 1024 ** 2),
  /** Files a complainant may add to one case in an hour (default 20). */
  EVIDENCE_COMPLAINANT_FILES_PER_HOUR: z.coerce.number().int().min(1).max(1000).default(20),
  SMTP_URL: url('SMTP_URL').refine((v) => /^smtps?:\/\//.test(v), 'SMTP_URL must start with smtp:// or smtps://'),
  MAIL_FROM: z.string().default('Quietband <no-reply@quietband.test>'),
  /** Folder where the local SMTP fake keeps messages; set only with the embedded fake. */
  DEV_MAILBOX_DIR: z.string().optional(),
  STATIC_DIR: z.string().optional(),
  /** Number of proxies (load balancers) in front, for client addresses and secure cookies. */
  TRUST_PROXY: z.coerce.number().int().min(0).max(10).default(0),
  /** Log level: fatal, error, warn, info, debug, trace or silent. */
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** json (one object a line, for log shippers) or pretty (readable); default pretty in development. */
  LOG_FORMAT: z.enum(['json', 'pretty']).optional(),
  /** Run the e-mail worker in this process (default yes; set false for API-only processes). */
  RUN_WORKERS: z.enum(['true', 'false']).default('true').transform((v) => v === 'true'),
  /** Seconds between the e-mail worker's looks for queued mail when the queue is empty. */
  MAIL_POLL_INTERVAL_SECONDS: z.coerce.number().min(0.5).max(60).default(1),
  /** Seconds between the job queue's maintenance runs, which retry mail left unfinished by a crash. */
  JOB_MAINTENANCE_INTERVAL_SECONDS: z.coerce.number().int().min(1).max(600).default(5),
  /**
   * A map tile server for the basemap: an http(s) URL template with {z}, {x} and {y} (and
   * optionally {s}). Unset: the offline basemap drawn from the region's own data. The
   * Content-Security-Policy's img-src then admits the URL's origin.
   */
  MAP_TILE_URL: z
    .string()
    .refine(isTileUrlTemplate, 'MAP_TILE_URL must be an http(s) URL template with {z}, {x} and {y}, e.g. https://tiles.example.org/{z}/{x}/{y}.png')
    .optional(),
  /**
   * The office's signing certificate and private key for case files (PDF), as a PKCS#12 file.
   * Required in production; unset elsewhere, a DEMO certificate is used (npm start keeps one in
   * .local). Checked at start: readable, passphrase right, in date, key matching the certificate.
   */
  CASE_FILE_P12_PATH: z.string().trim().min(1, 'CASE_FILE_P12_PATH must not be empty').optional(),
  /** The PKCS#12's passphrase (empty when unset). */
  CASE_FILE_P12_PASSPHRASE: z.string().default(''),
  /** The tile server's required credit (plain text); required with MAP_TILE_URL. */
  MAP_TILE_ATTRIBUTION: z.string().trim().min(1, 'MAP_TILE_ATTRIBUTION must not be empty').max(300).optional(),
})

export type Env = z.infer<typeof envSchema> & { MIGRATION_DATABASE_URL: string }

export class ConfigError extends Error {}

/** Parses the environment; throws a ConfigError listing every bad variable by name. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema
    .refine((e) => !e.MAP_TILE_URL || !!e.MAP_TILE_ATTRIBUTION, { path: ['MAP_TILE_ATTRIBUTION'], message: 'MAP_TILE_ATTRIBUTION is required with MAP_TILE_URL (the tile server’s credit)' })
    .refine((e) => e.NODE_ENV !== 'production' || !!e.CASE_FILE_P12_PATH, {
      path: ['CASE_FILE_P12_PATH'],
      message: 'CASE_FILE_P12_PATH is required in production: the office’s PKCS#12 certificate that signs case files (a demo certificate is used only outside production)',
    })
    .safeParse(source)
  if (parsed.success) return { ...parsed.data, MIGRATION_DATABASE_URL: parsed.data.MIGRATION_DATABASE_URL ?? parsed.data.DATABASE_URL }
  const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
  throw new ConfigError(`Quietband cannot start: the configuration is incomplete or invalid.\n${lines.join('\n')}\nSee .env.example.`)
}

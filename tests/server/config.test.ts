import { execFile } from 'node:child_process'
import { promisify } from 'node:util'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { ConfigError, loadEnv } from '../../server/config/env'

const root = fileURLToPath(new URL('../..', import.meta.url))
const complete = {
  PUBLIC_URL: 'http://127.0.0.1:3000',
  DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db',
  SESSION_SECRET: 'x'.repeat(40),
  S3_BUCKET: 'evidence',
  S3_ACCESS_KEY_ID: 'key',
  S3_SECRET_ACCESS_KEY: 'secret',
  SMTP_URL: 'smtp://127.0.0.1:2525',
}

describe('configuration', () => {
  it('accepts a complete environment and applies defaults', () => {
    const env = loadEnv(complete)
    expect(env.PORT).toBe(3000)
    expect(env.S3_FORCE_PATH_STYLE).toBe(true)
  })

  it.each([
    ['DATABASE_URL', { DATABASE_URL: undefined }],
    ['DATABASE_URL', { DATABASE_URL: 'mysql://x@y/z' }],
    ['SESSION_SECRET', { SESSION_SECRET: 'short' }],
    ['SMTP_URL', { SMTP_URL: 'http://mail.example' }],
    ['PORT', { PORT: 'eighty' }],
  ])('names %s when it is missing or invalid', (name, change) => {
    expect(() => loadEnv({ ...complete, ...change })).toThrow(ConfigError)
    expect(() => loadEnv({ ...complete, ...change })).toThrow(new RegExp(`\\b${name}:`))
  })

  it('the server process refuses to start and names every missing variable', async () => {
    const run = promisify(execFile)(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: root, env: { PATH: process.env.PATH } })
    const err = await run.then(() => null, (e: { code: number; stderr: string }) => e)
    expect(err, 'the process must fail').not.toBeNull()
    expect(err!.code).toBe(78)
    for (const name of ['DATABASE_URL', 'SESSION_SECRET', 'SMTP_URL', 'PUBLIC_URL', 'S3_BUCKET']) expect(err!.stderr).toContain(name)
  })
})

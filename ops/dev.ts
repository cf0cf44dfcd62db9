/**
 * `npm run dev`: the local services, a watching API server and the Vite dev server with
 * its /api proxy. Open http://127.0.0.1:5173. Ctrl-C stops everything it started.
 */
import { spawn, type ChildProcess } from 'node:child_process'
import path from 'node:path'
import { createPool } from '../server/db/client'
import { prepareDatabase } from '../server/db/roles'
import { ensureLocalServices, loadDotEnv, LocalServiceError, ROOT } from './local/services'
import { seedDemo } from './seed-demo'
import { loadEnv } from '../server/config/env'
import { objectStoreFromEnv } from '../server/storage/object-store'

loadDotEnv()
const services = await ensureLocalServices().catch((e: unknown) => {
  if (e instanceof LocalServiceError) process.exit(1) // explained in one line already
  throw e
})
const port = process.env.PORT ?? '3000'
const env: NodeJS.ProcessEnv = {
  ...process.env,
  ...services.env,
  PORT: port,
  PUBLIC_URL: process.env.PUBLIC_URL ?? 'http://127.0.0.1:5173',
  AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
}
// migrations and the demo (told on its own clock) run as the owner role
const ownerUrl = env.MIGRATION_DATABASE_URL ?? env.DATABASE_URL!
await prepareDatabase(ownerUrl)
const pool = createPool(ownerUrl, 2)
// the demo licence register goes through the object store (skipped when the configuration is incomplete: the API says why)
let objectStore: ReturnType<typeof objectStoreFromEnv> | undefined
try {
  objectStore = objectStoreFromEnv(loadEnv(env))
} catch {
  objectStore = undefined
}
await seedDemo(pool, { objectStore })
await pool.end()

const children: ChildProcess[] = [
  spawn(process.execPath, ['--watch', '--import', 'tsx', 'server/index.ts'], { cwd: ROOT, env, stdio: 'inherit' }),
  spawn(process.execPath, [path.join(ROOT, 'node_modules/vite/bin/vite.js')], { cwd: ROOT, env, stdio: 'inherit' }),
]
console.log(`\nQuietband (development): http://127.0.0.1:5173  — API on :${port}; mailbox at /dev/mailbox\n`)

let stopping = false
async function stop() {
  if (stopping) return
  stopping = true
  for (const c of children) c.kill('SIGTERM')
  await Promise.all(children.map((c) => new Promise((r) => (c.exitCode !== null ? r(null) : c.once('exit', r)))))
  await services.stop()
  process.exit(0)
}
process.once('SIGINT', () => void stop())
process.once('SIGTERM', () => void stop())

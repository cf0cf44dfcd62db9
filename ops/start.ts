/**
 * `npm start`: the whole of Quietband on this machine, from one command.
 * Ensures the local services (unless real ones are configured), migrates, seeds the demo
 * on an empty database, builds the web app when needed, and serves web + API on one port.
 * Ctrl-C stops everything it started.
 */
import { ConfigError, loadEnv } from '../server/config/env'
import { createPool } from '../server/db/client'
import { appRoleIsProtected, prepareDatabase } from '../server/db/roles'
import { startServer } from '../server/main'
import { objectStoreFromEnv } from '../server/storage/object-store'
import { ensureLocalServices, loadDotEnv, LocalServiceError } from './local/services'
import { ensureWebBuild, WEB_DIST } from './local/web-build'
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from './seed-demo'
import { MAILBOX_REFUSAL_WORDS, MAILBOX_RULE, mailboxSetting } from '../server/modules/dev/mailbox-guard'

/** Says exactly whether the development mailbox is on, and for whom. */
function mailboxBanner(env: { DEV_MAILBOX_DIR?: string; NODE_ENV: string; HOST: string; TRUST_PROXY: number; PUBLIC_URL: string }): string {
  const setting = mailboxSetting({ dir: env.DEV_MAILBOX_DIR, nodeEnv: env.NODE_ENV, listenHost: env.HOST, trustProxy: env.TRUST_PROXY })
  if (setting.on) return `Development mailbox: ON at ${env.PUBLIC_URL}/dev/mailbox, for browsers on this machine only (it shows every e-mail sent, reset links included).\n`
  return `Development mailbox: off (${MAILBOX_REFUSAL_WORDS[setting.reason]}). ${MAILBOX_RULE}\n`
}

const t0 = performance.now()
loadDotEnv()
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true'
const services = await ensureLocalServices().catch((e: unknown) => {
  // an expected condition (a taken port) has been explained in one line already
  if (e instanceof LocalServiceError) process.exit(1)
  throw e
})
Object.assign(process.env, services.env)
const port = process.env.PORT ?? '3000'
process.env.PUBLIC_URL ??= `http://127.0.0.1:${port}`
process.env.STATIC_DIR ??= WEB_DIST

let stopping = false
async function shutdown(code: number, running?: { close(): Promise<void> }) {
  if (stopping) return
  stopping = true
  console.log('\nStopping Quietband…')
  await running?.close().catch((e) => console.error(e))
  await services.stop()
  process.exit(code)
}

try {
  const env = loadEnv()
  // migrations and the demo (told on its own clock) run as the owner role
  await prepareDatabase(env.MIGRATION_DATABASE_URL)
  const protectedTimeline = await appRoleIsProtected(env.DATABASE_URL)
  const pool = createPool(env.MIGRATION_DATABASE_URL, 2)
  const seeded = await seedDemo(pool, { objectStore: objectStoreFromEnv(env) })
  await pool.end()
  const build = ensureWebBuild()
  const running = await startServer(env)
  const secs = ((performance.now() - t0) / 1000).toFixed(1)
  console.log(`
Quietband is running at ${env.PUBLIC_URL}   (ready in ${secs} s; web build ${build}${seeded ? '; demo data seeded' : ''})
Local services: ${services.started.join('; ') || 'none (real services configured)'}
${protectedTimeline ? '' : 'Warning: the app connects as the database owner, so the timeline is not protected (set MIGRATION_DATABASE_URL to the owner and DATABASE_URL to an application role; see README "Database roles").\n'}${mailboxBanner(env)}
Demo sign-ins (password "${DEMO_PASSWORD}"):
${DEMO_USERS.map((u) => `  ${u.role.padEnd(13)} ${u.email.padEnd(30)} ${u.office ?? ''}`).join('\n')}

Press Ctrl-C to stop.`)
  process.once('SIGINT', () => void shutdown(0, running))
  process.once('SIGTERM', () => void shutdown(0, running))
} catch (e) {
  console.error(e instanceof ConfigError ? e.message : e)
  await shutdown(1)
}

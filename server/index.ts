/**
 * Production entry: every setting comes from the environment (see .env.example).
 * Run with `node --import tsx server/index.ts`. For the local stack use `npm start`.
 */
import { ConfigError, loadEnv } from './config/env'
import { guardProcess, startServer } from './main'
import { mailboxSetting } from './modules/dev/mailbox-guard'

guardProcess()

try {
  const env = loadEnv()
  const running = await startServer(env)
  console.log(`Quietband listening on ${running.url}`)
  const mailbox = mailboxSetting({ dir: env.DEV_MAILBOX_DIR, nodeEnv: env.NODE_ENV, listenHost: env.HOST, trustProxy: env.TRUST_PROXY })
  if (mailbox.on) console.log('Development mailbox: ON at /dev/mailbox, for browsers on this machine only (unset DEV_MAILBOX_DIR to turn it off).')
  const stop = () => void running.close().then(() => process.exit(0))
  process.once('SIGINT', stop)
  process.once('SIGTERM', stop)
} catch (e) {
  if (e instanceof ConfigError) {
    console.error(e.message)
    process.exit(78) // EX_CONFIG
  }
  throw e
}

/**
 * Production entry: every setting comes from the environment (see .env.example).
 * Run with `node --import tsx server/index.ts`. For the local stack use `npm start`.
 */
import { ConfigError, loadEnv } from './config/env'
import { startServer } from './main'

try {
  const env = loadEnv()
  const running = await startServer(env)
  console.log(`Quietband listening on ${running.url}`)
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

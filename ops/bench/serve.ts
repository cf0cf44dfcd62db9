/**
 * A benchmark server in its own process (so the load generator does not share its event
 * loop): Quietband's app on 127.0.0.1, on a free port, wired to the given database. Prints
 * `listening <url>` when ready; stops on SIGINT or SIGTERM.
 *
 *   node --import tsx ops/bench/serve.ts --database-url URL [--pool-max 10]
 */
import { argValue, startBenchServer } from './support'

const databaseUrl = argValue('--database-url', process.env.DATABASE_URL)
if (!databaseUrl) {
  console.error('usage: node --import tsx ops/bench/serve.ts --database-url URL [--pool-max 10]')
  process.exit(2)
}
const server = await startBenchServer(databaseUrl, { poolMax: Number(argValue('--pool-max', '10')) })
console.log(`listening ${server.url}`)
const stop = () => {
  server.close().then(
    () => process.exit(0),
    (e: unknown) => {
      console.error(e)
      process.exit(1)
    },
  )
}
process.once('SIGINT', stop)
process.once('SIGTERM', stop)

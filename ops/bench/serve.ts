/**
 * A benchmark server in its own process (so the load generator does not share its event
 * loop): Quietband's app on 127.0.0.1, on a free port, wired to the given database. Prints
 * `listening <url>` when ready; stops on SIGINT or SIGTERM.
 *
 *   node --import tsx ops/bench/serve.ts --database-url URL [--pool-max 10]
 *     [--s3-endpoint URL --s3-bucket NAME [--upload-max-bytes N]]   (a file store: the local S3 fake's keys)
 */
import { createObjectStore } from '../../server/storage/object-store'
import { argValue, startBenchServer } from './support'

const databaseUrl = argValue('--database-url', process.env.DATABASE_URL)
if (!databaseUrl) {
  console.error('usage: node --import tsx ops/bench/serve.ts --database-url URL [--pool-max 10]')
  process.exit(2)
}
const s3Endpoint = argValue('--s3-endpoint', undefined)
const maxBytes = Number(argValue('--upload-max-bytes', String(2 * 1024 ** 3)))
const objectStore = s3Endpoint
  ? createObjectStore({
      endpoint: s3Endpoint,
      region: 'us-east-1',
      bucket: argValue('--s3-bucket', 'bench') as string,
      accessKeyId: 'S3RVER',
      secretAccessKey: 'S3RVER',
      forcePathStyle: true,
      maxUploadBytes: maxBytes,
      evidenceMaxBytes: { staff: maxBytes, complainant: 25 * 1024 ** 2 },
    })
  : undefined
const server = await startBenchServer(databaseUrl, { poolMax: Number(argValue('--pool-max', '10')), objectStore })
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

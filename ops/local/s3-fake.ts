/** Local S3-compatible store (s3rver) on loopback for development and tests. */
import fs from 'node:fs/promises'
// s3rver 3.7.1 ships no types
// @ts-expect-error no declaration file
import S3rver from 's3rver'

export interface S3Fake {
  endpoint: string
  accessKeyId: string
  secretAccessKey: string
  bucket: string
  directory: string
  close(): Promise<void>
}

export async function startS3Fake(opts: { directory: string; bucket: string; port?: number }): Promise<S3Fake> {
  await fs.mkdir(opts.directory, { recursive: true })
  const server = new S3rver({
    address: '127.0.0.1',
    port: opts.port ?? 0,
    directory: opts.directory,
    silent: true,
    configureBuckets: [{ name: opts.bucket }],
  })
  const { address, port } = (await server.run()) as { address: string; port: number }
  return {
    endpoint: `http://${address}:${port}`,
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    bucket: opts.bucket,
    directory: opts.directory,
    close: () => server.close() as Promise<void>,
  }
}

import crypto from 'node:crypto'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { Readable } from 'node:stream'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { GetObjectCommand, HeadObjectCommand, PutObjectCommand } from '@aws-sdk/client-s3'
import { Upload } from '@aws-sdk/lib-storage'
import { createS3Client } from '../../server/storage/s3'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'

let fake: S3Fake
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-s3-'))
beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'evidence-test' })
})
afterAll(async () => {
  await fake.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

const sha256 = (b: Buffer) => crypto.createHash('sha256').update(b).digest('hex')
async function readAll(body: unknown): Promise<Buffer> {
  const chunks: Buffer[] = []
  for await (const c of body as AsyncIterable<Buffer>) chunks.push(c)
  return Buffer.concat(chunks)
}

describe('the evidence store client', () => {
  const client = () => createS3Client({ ...fake, region: 'us-east-1', forcePathStyle: true })

  it('keeps a streamed 8 MB upload byte for byte (checksum settings)', async () => {
    const data = crypto.randomBytes(8 * 1024 * 1024)
    await client().send(new PutObjectCommand({ Bucket: fake.bucket, Key: 'stream.bin', Body: Readable.from([data]), ContentLength: data.length }))
    const head = await client().send(new HeadObjectCommand({ Bucket: fake.bucket, Key: 'stream.bin' }))
    expect(head.ContentLength).toBe(data.length)
    const got = await client().send(new GetObjectCommand({ Bucket: fake.bucket, Key: 'stream.bin' }))
    expect(sha256(await readAll(got.Body))).toBe(sha256(data))
  })

  it('keeps a multipart upload of unknown length intact', async () => {
    const data = crypto.randomBytes(12 * 1024 * 1024)
    await new Upload({ client: client(), params: { Bucket: fake.bucket, Key: 'multi.bin', Body: Readable.from([data.subarray(0, 7e6), data.subarray(7e6)]) }, partSize: 5 * 1024 * 1024 }).done()
    const got = await client().send(new GetObjectCommand({ Bucket: fake.bucket, Key: 'multi.bin' }))
    expect(sha256(await readAll(got.Body))).toBe(sha256(data))
  })
})

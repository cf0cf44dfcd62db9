/**
 * The S3-compatible evidence store. Both checksum settings are WHEN_REQUIRED: with the SDK's
 * defaults a streamed upload to a store that does not speak aws-chunked framing (s3rver) is
 * saved corrupted while answering 200, and presigned PUT URLs carry an empty-body checksum.
 */
import { S3Client } from '@aws-sdk/client-s3'

export interface S3Settings {
  endpoint?: string
  region: string
  bucket: string
  accessKeyId: string
  secretAccessKey: string
  forcePathStyle: boolean
}

export function createS3Client(s: S3Settings): S3Client {
  return new S3Client({
    endpoint: s.endpoint,
    region: s.region,
    forcePathStyle: s.forcePathStyle,
    credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  })
}

/**
 * Deletes an evidence object from the store: the one place Quietband deletes evidence (the
 * retention run, which records each deletion). Unlike removeObject, a failure is thrown, so the
 * run's transaction rolls back and nothing is recorded as disposed that is still stored.
 * Deleting a key that is already gone succeeds (S3 semantics), so a retried run completes.
 */
import { DeleteObjectCommand } from '@aws-sdk/client-s3'
import type { ObjectStore } from '../../storage/object-store'

export async function disposeObject(store: ObjectStore, objectKey: string): Promise<void> {
  await store.client.send(new DeleteObjectCommand({ Bucket: store.bucket, Key: objectKey }))
}

/**
 * Deletes an evidence object (or its thumbnail) from the store: the one place Quietband deletes
 * evidence (the retention run, after it has committed the deletion as 'pending'). Unlike
 * removeObject, a failure is thrown, so the run leaves the deletion pending and never records it
 * done. Deleting a key that is already gone succeeds (S3 semantics), so a later run completes it.
 */
import { DeleteObjectCommand } from '@aws-sdk/client-s3'
import type { ObjectStore } from '../../storage/object-store'

export async function disposeObject(store: ObjectStore, objectKey: string): Promise<void> {
  await store.client.send(new DeleteObjectCommand({ Bucket: store.bucket, Key: objectKey }))
}

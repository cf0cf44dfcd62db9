import fs from 'node:fs/promises'
import path from 'node:path'
import type { MailboxMessage } from '../../shared/schemas/views'

/** A message as the local SMTP fake keeps it (<id>.json beside <id>.eml). */
export type StoredMessage = MailboxMessage

/** Messages kept by the local SMTP fake in `dir`, newest first. */
export async function readMailbox(dir: string): Promise<StoredMessage[]> {
  let names: string[]
  try {
    names = await fs.readdir(dir)
  } catch {
    return []
  }
  const messages = await Promise.all(
    names.filter((n) => n.endsWith('.json')).map(async (n) => JSON.parse(await fs.readFile(path.join(dir, n), 'utf8')) as StoredMessage),
  )
  return messages.sort((a, b) => (a.id < b.id ? 1 : -1))
}

/**
 * A small streaming reader of tar archives (a SigMF archive is a tar file): headers are parsed
 * as the bytes arrive and each member's content is handed on in the chunks it came in, so an
 * archive is never held in memory. Reads POSIX ustar headers, pax extended headers (`path`,
 * `size`) and GNU long names; refuses absolute or parent-escaping member names, links and
 * special files, members larger than the caller allows, bad header checksums and an archive
 * that ends inside a member.
 *
 * Format: POSIX.1-2008 `pax` / ustar interchange format (header fields: name 0–99, size
 * 124–135 octal, chksum 148–155, typeflag 156, magic 257–262, prefix 345–499).
 */

export class TarError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'TarError'
  }
}

export interface TarMember {
  /** Path inside the archive, '/'-separated, never absolute, never escaping with '..'. */
  name: string
  sizeBytes: number
  kind: 'file' | 'directory'
}

/** Receives one member's content; `write` may return a promise (the reader waits). */
export interface TarMemberSink {
  write(chunk: Uint8Array): void | Promise<void>
  end(): void | Promise<void>
}

const BLOCK = 512
/** Pax and GNU long-name headers are small; more is not a real archive. */
const MAX_EXTENDED_HEADER_BYTES = 64 * 1024

/** Checks a member name: relative, no '..' segment, no backslash, NUL or drive letter. */
export function checkMemberName(name: string): string {
  if (name === '') throw new TarError('The archive holds a member without a name.')
  if (name.startsWith('/') || /^[A-Za-z]:/.test(name) || name.includes('\\') || name.includes('\0')) {
    throw new TarError(`The archive member "${printable(name)}" has an absolute or unsafe path; such archives are refused.`)
  }
  if (name.split('/').some((part) => part === '..')) {
    throw new TarError(`The archive member "${printable(name)}" points outside the archive ("..") ; such archives are refused.`)
  }
  return name.replace(/^(\.\/)+/, '')
}

const printable = (s: string) => JSON.stringify(s.slice(0, 200)).slice(1, -1)

function field(block: Uint8Array, from: number, length: number): string {
  let end = from
  while (end < from + length && block[end] !== 0) end++
  return new TextDecoder('utf-8').decode(block.subarray(from, end))
}

function numberField(block: Uint8Array, from: number, length: number, what: string): number {
  if (block[from] & 0x80) {
    // base-256 (GNU) for values that do not fit in octal
    let v = 0
    for (let i = from + 1; i < from + length; i++) v = v * 256 + block[i]
    if (!Number.isSafeInteger(v)) throw new TarError(`The archive's ${what} field is out of range.`)
    return v
  }
  const text = field(block, from, length).trim()
  if (text === '') return 0
  if (!/^[0-7]+$/.test(text)) throw new TarError(`The archive's ${what} field is not an octal number ("${printable(text)}"): this is not a tar archive or it is damaged.`)
  return parseInt(text, 8)
}

function checksumOk(block: Uint8Array): boolean {
  const stored = numberField(block, 148, 8, 'checksum')
  let sum = 0
  for (let i = 0; i < BLOCK; i++) sum += i >= 148 && i < 156 ? 32 : block[i]
  return sum === stored
}

function parsePax(body: Uint8Array): Record<string, string> {
  const out: Record<string, string> = {}
  const text = new TextDecoder('utf-8').decode(body)
  let at = 0
  while (at < text.length) {
    const space = text.indexOf(' ', at)
    if (space < 0) break
    const len = Number(text.slice(at, space))
    if (!Number.isInteger(len) || len <= 0) throw new TarError('The archive has a damaged pax extended header.')
    const record = text.slice(space + 1, at + len - 1)
    const eq = record.indexOf('=')
    if (eq > 0) out[record.slice(0, eq)] = record.slice(eq + 1)
    at += len
  }
  return out
}

/**
 * Reads the archive from `source`, calling `visit` for each file or directory member; the sink
 * it returns gets the member's content (undefined: the content is skipped). `maxMemberBytes`
 * is checked on the declared size before any content is read.
 */
export async function readTar(
  source: AsyncIterable<Uint8Array>,
  visit: (member: TarMember) => TarMemberSink | undefined | Promise<TarMemberSink | undefined>,
  opts: { maxMemberBytes: (name: string) => number },
): Promise<void> {
  const header = new Uint8Array(BLOCK)
  let headerFill = 0
  /** What the next bytes are: a header, a member's content, an extended header's body, padding to the next block. */
  let mode = 'header' as 'header' | 'content' | 'extended' | 'padding' | 'done'
  let remaining = 0
  let padding = 0
  let sink: TarMemberSink | undefined
  let current: TarMember | undefined
  let extended: { kind: 'pax' | 'gnu-name' | 'skip'; chunks: Uint8Array[] } | undefined
  let nextName: string | undefined
  let nextSize: number | undefined

  /** After a body: skip its padding, then the next header. */
  const afterBody = () => {
    mode = padding > 0 ? 'padding' : 'header'
    remaining = padding
  }

  const endContent = async () => {
    const s = sink
    sink = undefined
    current = undefined
    await s?.end()
    afterBody()
  }

  const endExtended = () => {
    const ext = extended!
    extended = undefined
    const body = Buffer.concat(ext.chunks)
    if (ext.kind === 'pax') {
      const pax = parsePax(body)
      if (pax.path !== undefined) nextName = pax.path
      if (pax.size !== undefined) {
        if (!/^\d+$/.test(pax.size)) throw new TarError('The archive has a pax size that is not a number.')
        nextSize = Number(pax.size)
      }
    } else if (ext.kind === 'gnu-name') {
      nextName = field(body, 0, body.length)
    }
    afterBody()
  }

  const onHeader = async () => {
    if (header.every((b) => b === 0)) {
      mode = 'done' // end-of-archive marker
      return
    }
    if (!checksumOk(header)) throw new TarError('The archive has a header with a wrong checksum: it is not a tar archive or it is damaged.')
    const type = String.fromCharCode(header[156] || 48)
    let size = numberField(header, 124, 12, 'size')
    if (type === 'x' || type === 'g' || type === 'L') {
      if (size > MAX_EXTENDED_HEADER_BYTES) throw new TarError('The archive has an extended header larger than 64 kB; it is refused.')
      extended = { kind: type === 'x' ? 'pax' : type === 'L' ? 'gnu-name' : 'skip', chunks: [] }
      padding = (BLOCK - (size % BLOCK)) % BLOCK
      remaining = size
      mode = 'extended'
      if (remaining === 0) endExtended()
      return
    }
    const magic = field(header, 257, 6)
    const prefix = magic.startsWith('ustar') ? field(header, 345, 155) : ''
    const rawName = nextName ?? (prefix ? `${prefix}/${field(header, 0, 100)}` : field(header, 0, 100))
    if (nextSize !== undefined) size = nextSize
    nextName = undefined
    nextSize = undefined
    const name = checkMemberName(rawName)
    if (type === '1' || type === '2') throw new TarError(`The archive member "${printable(name)}" is a link; archives with links are refused.`)
    if (type !== '0' && type !== '7' && type !== '5') throw new TarError(`The archive member "${printable(name)}" is not a regular file (type '${printable(type)}'); it is refused.`)
    const kind = type === '5' ? 'directory' : 'file'
    const limit = opts.maxMemberBytes(name)
    if (kind === 'file' && size > limit) {
      throw new TarError(`The archive member "${printable(name)}" is ${size} bytes, more than the ${limit} bytes allowed for it.`)
    }
    current = { name: kind === 'directory' ? name.replace(/\/+$/, '') : name, sizeBytes: size, kind }
    sink = (await visit(current)) ?? undefined
    padding = (BLOCK - (size % BLOCK)) % BLOCK
    remaining = size
    mode = 'content'
    if (remaining === 0) await endContent()
  }

  for await (const chunk of source) {
    let at = 0
    while (at < chunk.length && mode !== 'done') {
      if (mode === 'header') {
        const take = Math.min(BLOCK - headerFill, chunk.length - at)
        header.set(chunk.subarray(at, at + take), headerFill)
        headerFill += take
        at += take
        if (headerFill === BLOCK) {
          headerFill = 0
          await onHeader()
        }
        continue
      }
      const take = Math.min(remaining, chunk.length - at)
      const part = chunk.subarray(at, at + take)
      if (mode === 'content') await sink?.write(part)
      else if (mode === 'extended') extended!.chunks.push(Uint8Array.from(part))
      remaining -= take
      at += take
      if (remaining === 0) {
        if (mode === 'content') await endContent()
        else if (mode === 'extended') endExtended()
        else mode = 'header'
      }
    }
    if (mode === 'done') break
  }
  if (mode === 'content' || mode === 'extended') {
    throw new TarError(`The archive ends inside ${current ? `the member "${printable(current.name)}"` : 'an extended header'} (${remaining} bytes missing): the file is truncated.`)
  }
  if (headerFill > 0) throw new TarError('The archive ends inside a header: the file is truncated.')
}

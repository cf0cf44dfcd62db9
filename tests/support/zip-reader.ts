/**
 * A small ZIP reader for tests: walks the central directory (end-of-central-directory record,
 * then each file header), reads each entry's bytes from its local header, inflates deflated
 * entries with node:zlib and checks every entry's CRC-32 against the directory. Enough for the
 * archives the app writes (no ZIP64, no encryption); anything else throws.
 */
import zlib from 'node:zlib'

export interface ZipEntry {
  name: string
  data: Buffer
}

const EOCD = 0x06054b50
const CENTRAL = 0x02014b50
const LOCAL = 0x04034b50

export function readZip(zip: Buffer): ZipEntry[] {
  let eocd = -1
  for (let i = zip.length - 22; i >= Math.max(0, zip.length - 22 - 0xffff); i--) {
    if (zip.readUInt32LE(i) === EOCD) {
      eocd = i
      break
    }
  }
  if (eocd < 0) throw new Error('not a ZIP: no end-of-central-directory record')
  const count = zip.readUInt16LE(eocd + 10)
  let at = zip.readUInt32LE(eocd + 16)
  if (count === 0xffff || at === 0xffffffff) throw new Error('ZIP64 archives are not read here')
  const entries: ZipEntry[] = []
  for (let n = 0; n < count; n++) {
    if (zip.readUInt32LE(at) !== CENTRAL) throw new Error(`bad central directory header at ${at}`)
    const method = zip.readUInt16LE(at + 10)
    const crc = zip.readUInt32LE(at + 16)
    const compressedSize = zip.readUInt32LE(at + 20)
    const size = zip.readUInt32LE(at + 24)
    const nameLength = zip.readUInt16LE(at + 28)
    const extraLength = zip.readUInt16LE(at + 30)
    const commentLength = zip.readUInt16LE(at + 32)
    const localAt = zip.readUInt32LE(at + 42)
    const name = zip.subarray(at + 46, at + 46 + nameLength).toString('utf8')
    at += 46 + nameLength + extraLength + commentLength

    if (zip.readUInt32LE(localAt) !== LOCAL) throw new Error(`bad local header of ${name}`)
    const dataAt = localAt + 30 + zip.readUInt16LE(localAt + 26) + zip.readUInt16LE(localAt + 28)
    const raw = zip.subarray(dataAt, dataAt + compressedSize)
    const data = method === 0 ? Buffer.from(raw) : method === 8 ? zlib.inflateRawSync(raw) : null
    if (!data) throw new Error(`${name}: compression method ${method} is not read here`)
    if (data.length !== size) throw new Error(`${name}: ${data.length} bytes, the directory says ${size}`)
    if (zlib.crc32(data) >>> 0 !== crc) throw new Error(`${name}: CRC-32 does not match the directory`)
    entries.push({ name, data })
  }
  return entries
}

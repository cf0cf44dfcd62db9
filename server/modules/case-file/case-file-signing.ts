/**
 * The office's signature on a case file: a PKCS#12 (certificate and private key) from
 * configuration, checked once at start (readable, passphrase right, in date, key matching the
 * certificate), and a PAdES signature (a CMS SignedData in the PDF's /Contents, sub-filter
 * ETSI.CAdES.detached) over the file's /ByteRange. The CMS carries the signed attributes a
 * PAdES baseline signature needs: content type, message digest and the ESS signing-certificate-v2
 * (the certificate's SHA-256); the signing time is the signature dictionary's /M.
 *
 * Outside production, with no certificate configured, a DEMO certificate is generated (its
 * subject says so, and the case file prints that it is a demo signature).
 */
import crypto from 'node:crypto'
import fs from 'node:fs'
import path from 'node:path'
import forge from 'node-forge'
import { plainAddPlaceholder } from '@signpdf/placeholder-plain'
import { SUBFILTER_ETSI_CADES_DETACHED, Signer } from '@signpdf/utils'
// the named export: a CommonJS default export reads differently under Node's own ESM loader and bundlers
import { SignPdf } from '@signpdf/signpdf'
import { ConfigError } from '../../config/env'

const { asn1, pki } = forge

/** The subject's common name of every generated demo certificate. */
export const DEMO_CERTIFICATE_NAME = 'Quietband DEMO case-file signer - NOT FOR LEGAL USE'
/** The passphrase of a generated demo PKCS#12 (a demo secret, printed nowhere that matters). */
export const DEMO_P12_PASSPHRASE = 'quietband-demo'
/** Room kept in the PDF for the CMS signature [bytes]; a 4096-bit key and a short chain fit. */
const SIGNATURE_LENGTH_BYTES = 12_000

export interface SigningCredentials {
  certificate: forge.pki.Certificate
  /** The private key as PEM, for node:crypto. */
  privateKeyPem: string
}

export interface CaseFileSigner {
  /** The certificate's subject as people read it (CN, O). */
  subject: string
  /** True for a generated demo certificate. */
  demo: boolean
  /** The certificate's SHA-256 fingerprint (lowercase hex). */
  certificateSha256: string
  notAfter: Date
  /** Signs a finished PDF (written without object streams): returns the signed file. */
  sign(pdf: Buffer, o: { reason: string; location: string; contactInfo: string; signingTime: Date }): Promise<Buffer>
}

const subjectText = (c: forge.pki.Certificate) =>
  ['CN', 'O', 'C']
    .map((s) => c.subject.getField(s)?.value as string | undefined)
    .filter(Boolean)
    .join(', ')

function certificateDer(c: forge.pki.Certificate): Buffer {
  return Buffer.from(asn1.toDer(pki.certificateToAsn1(c)).getBytes(), 'binary')
}

/** Reads a PKCS#12; throws a plain Error saying what is wrong. */
export function credentialsFromP12(p12: Buffer, passphrase: string): SigningCredentials {
  let parsed: forge.pkcs12.Pkcs12Pfx
  try {
    parsed = forge.pkcs12.pkcs12FromAsn1(asn1.fromDer(forge.util.createBuffer(p12.toString('binary'))), false, passphrase)
  } catch (e) {
    throw new Error(`it cannot be read as PKCS#12 with the passphrase given (${(e as Error).message})`, { cause: e })
  }
  const keys = [...(parsed.getBags({ bagType: pki.oids.pkcs8ShroudedKeyBag })[pki.oids.pkcs8ShroudedKeyBag] ?? []), ...(parsed.getBags({ bagType: pki.oids.keyBag })[pki.oids.keyBag] ?? [])]
  const key = keys.find((b) => b.key)?.key as forge.pki.rsa.PrivateKey | undefined
  if (!key) throw new Error('it holds no private key')
  const certs = (parsed.getBags({ bagType: pki.oids.certBag })[pki.oids.certBag] ?? []).flatMap((b) => (b.cert ? [b.cert] : []))
  if (certs.length === 0) throw new Error('it holds no certificate')
  const certificate = certs.find((c) => {
    const pub = c.publicKey as forge.pki.rsa.PublicKey
    return pub.n?.compareTo(key.n) === 0 && pub.e?.compareTo(key.e) === 0
  })
  if (!certificate) throw new Error('its certificate does not match its private key')
  return { certificate, privateKeyPem: pki.privateKeyToPem(key) }
}

/**
 * The signer of a configured PKCS#12, checked as the server starts: a ConfigError names the
 * setting when the file is missing or unreadable, the passphrase wrong, the certificate out of
 * date or not matching its key.
 */
export function signerFromP12File(file: string, passphrase: string, now: Date = new Date()): CaseFileSigner {
  let bytes: Buffer
  try {
    bytes = fs.readFileSync(file)
  } catch (e) {
    throw new ConfigError(`Quietband cannot start: CASE_FILE_P12_PATH (${file}) cannot be read: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}.`, { cause: e })
  }
  let creds: SigningCredentials
  try {
    creds = credentialsFromP12(bytes, passphrase)
  } catch (e) {
    throw new ConfigError(`Quietband cannot start: CASE_FILE_P12_PATH (${file}) is not a usable signing certificate: ${(e as Error).message} (see also CASE_FILE_P12_PASSPHRASE).`, { cause: e })
  }
  const { notBefore, notAfter } = creds.certificate.validity
  if (now < notBefore || now > notAfter) {
    throw new ConfigError(
      `Quietband cannot start: the certificate in CASE_FILE_P12_PATH (${file}) is valid from ${notBefore.toISOString()} to ${notAfter.toISOString()}, not now: case files cannot be signed with it.`,
    )
  }
  return signerOf(creds)
}

/** A new self-signed DEMO certificate and key (RSA 2048, SHA-256, one year). */
export function generateDemoCredentials(now: Date = new Date()): SigningCredentials {
  const { privateKey, publicKey } = crypto.generateKeyPairSync('rsa', { modulusLength: 2048 })
  const privateKeyPem = privateKey.export({ type: 'pkcs8', format: 'pem' }).toString()
  const cert = pki.createCertificate()
  cert.publicKey = pki.publicKeyFromPem(publicKey.export({ type: 'spki', format: 'pem' }).toString())
  cert.serialNumber = `01${crypto.randomBytes(8).toString('hex')}`
  cert.validity.notBefore = new Date(now.getTime() - 3600_000)
  cert.validity.notAfter = new Date(now.getTime() + 365 * 86_400_000)
  const attrs = [
    { shortName: 'CN', value: DEMO_CERTIFICATE_NAME },
    { shortName: 'O', value: 'Quietband demo office (DEMO)' },
  ]
  cert.setSubject(attrs)
  cert.setIssuer(attrs)
  cert.setExtensions([
    { name: 'basicConstraints', cA: false },
    { name: 'keyUsage', digitalSignature: true, nonRepudiation: true },
  ])
  cert.sign(pki.privateKeyFromPem(privateKeyPem), forge.md.sha256.create())
  return { certificate: cert, privateKeyPem }
}

/** The credentials as a PKCS#12 file's bytes (3DES, as most tools read it). */
export function credentialsToP12(c: SigningCredentials, passphrase: string): Buffer {
  const p12 = forge.pkcs12.toPkcs12Asn1(pki.privateKeyFromPem(c.privateKeyPem), [c.certificate], passphrase, { algorithm: '3des', friendlyName: 'case-file-signer' })
  return Buffer.from(asn1.toDer(p12).getBytes(), 'binary')
}

/**
 * The demo PKCS#12 at `file`, generated there on first use (folder made, mode 600). A file
 * whose certificate has expired is replaced.
 */
export function ensureDemoP12(file: string, now: Date = new Date()): { path: string; passphrase: string } {
  if (fs.existsSync(file)) {
    try {
      const c = credentialsFromP12(fs.readFileSync(file), DEMO_P12_PASSPHRASE)
      if (c.certificate.validity.notAfter > now) return { path: file, passphrase: DEMO_P12_PASSPHRASE }
    } catch {
      // unreadable: made again below
    }
  }
  fs.mkdirSync(path.dirname(file), { recursive: true })
  fs.writeFileSync(file, credentialsToP12(generateDemoCredentials(now), DEMO_P12_PASSPHRASE), { mode: 0o600 })
  return { path: file, passphrase: DEMO_P12_PASSPHRASE }
}

let processDemo: CaseFileSigner | undefined
/** One demo signer per process (tests and `node server/index.ts` in development without a certificate). */
export function processDemoSigner(): CaseFileSigner {
  processDemo ??= signerOf(generateDemoCredentials())
  return processDemo
}

const attribute = (oid: string, value: forge.asn1.Asn1) =>
  asn1.create(asn1.Class.UNIVERSAL, asn1.Type.SEQUENCE, true, [asn1.create(asn1.Class.UNIVERSAL, asn1.Type.OID, false, asn1.oidToDer(oid).getBytes()), asn1.create(asn1.Class.UNIVERSAL, asn1.Type.SET, true, [value])])
const oid = (o: string) => asn1.create(asn1.Class.UNIVERSAL, asn1.Type.OID, false, asn1.oidToDer(o).getBytes())
const octets = (b: Buffer) => asn1.create(asn1.Class.UNIVERSAL, asn1.Type.OCTETSTRING, false, b.toString('binary'))
const seq = (items: forge.asn1.Asn1[]) => asn1.create(asn1.Class.UNIVERSAL, asn1.Type.SEQUENCE, true, items)
const set = (items: forge.asn1.Asn1[]) => asn1.create(asn1.Class.UNIVERSAL, asn1.Type.SET, true, items)
const int = (n: number) => asn1.create(asn1.Class.UNIVERSAL, asn1.Type.INTEGER, false, asn1.integerToDer(n).getBytes())
const der = (a: forge.asn1.Asn1) => Buffer.from(asn1.toDer(a).getBytes(), 'binary')
const SHA256_ALG = () => seq([oid(pki.oids.sha256!), asn1.create(asn1.Class.UNIVERSAL, asn1.Type.NULL, false, '')])
const OID_SIGNING_CERTIFICATE_V2 = '1.2.840.113549.1.9.16.2.47'

/**
 * A detached CMS SignedData (RFC 5652) over `content`, with the signed attributes of a PAdES
 * baseline signature (ETSI EN 319 142-1 §5.1: content-type, message-digest,
 * signing-certificate-v2; no signing-time, which is the PDF's /M).
 */
export function cmsDetachedSignature(content: Buffer, c: SigningCredentials): Buffer {
  const certDer = certificateDer(c.certificate)
  const certHash = crypto.createHash('sha256').update(certDer).digest()
  const attrs = [
    attribute(pki.oids.contentType!, oid(pki.oids.data!)),
    attribute(pki.oids.messageDigest!, octets(crypto.createHash('sha256').update(content).digest())),
    // SigningCertificateV2 ::= SEQUENCE { certs SEQUENCE OF ESSCertIDv2 }; ESSCertIDv2 with the default SHA-256 leaves out its algorithm
    attribute(OID_SIGNING_CERTIFICATE_V2, seq([seq([seq([octets(certHash)])])])),
  ]
  // DER's SET OF is sorted by the encodings; the signature is over the SET, sent as [0] IMPLICIT
  const sorted = attrs.map(der).sort(Buffer.compare)
  const signedAttrsSet = Buffer.concat([derHeader(0x31, sorted.reduce((n, b) => n + b.length, 0)), ...sorted])
  const signature = crypto.sign('sha256', signedAttrsSet, c.privateKeyPem)
  const certAsn1 = pki.certificateToAsn1(c.certificate)
  const tbs = (certAsn1.value as forge.asn1.Asn1[])[0]!.value as forge.asn1.Asn1[]
  // TBSCertificate: [0] version, serialNumber, signature, issuer, …
  const serial = tbs[1]!
  const issuer = tbs[3]!
  const signedAttrs = asn1.create(
    asn1.Class.CONTEXT_SPECIFIC,
    0,
    true,
    sorted.map((b) => asn1.fromDer(forge.util.createBuffer(b.toString('binary')))),
  )
  const signerInfo = seq([
    int(1),
    seq([issuer, serial]),
    SHA256_ALG(),
    signedAttrs,
    seq([oid(pki.oids.rsaEncryption!), asn1.create(asn1.Class.UNIVERSAL, asn1.Type.NULL, false, '')]),
    octets(signature),
  ])
  const signedData = seq([int(1), set([SHA256_ALG()]), seq([oid(pki.oids.data!)]), asn1.create(asn1.Class.CONTEXT_SPECIFIC, 0, true, [certAsn1]), set([signerInfo])])
  return der(seq([oid(pki.oids.signedData!), asn1.create(asn1.Class.CONTEXT_SPECIFIC, 0, true, [signedData])]))
}

function derHeader(tag: number, length: number): Buffer {
  if (length < 0x80) return Buffer.from([tag, length])
  const bytes: number[] = []
  for (let n = length; n > 0; n = Math.floor(n / 256)) bytes.unshift(n & 0xff)
  return Buffer.from([tag, 0x80 | bytes.length, ...bytes])
}

class CadesSigner extends Signer {
  constructor(private readonly creds: SigningCredentials) {
    super()
  }
  override async sign(pdfBuffer: Buffer): Promise<Buffer> {
    return cmsDetachedSignature(pdfBuffer, this.creds)
  }
}

/** A signer of these credentials. */
export function signerOf(creds: SigningCredentials): CaseFileSigner {
  const subject = subjectText(creds.certificate)
  const signer = new CadesSigner(creds)
  return {
    subject,
    demo: subject.includes('DEMO'),
    certificateSha256: crypto.createHash('sha256').update(certificateDer(creds.certificate)).digest('hex'),
    notAfter: creds.certificate.validity.notAfter,
    async sign(pdf, o) {
      const withPlaceholder = plainAddPlaceholder({
        pdfBuffer: pdf,
        reason: o.reason,
        location: o.location,
        contactInfo: o.contactInfo,
        name: subject,
        signingTime: o.signingTime,
        signatureLength: SIGNATURE_LENGTH_BYTES,
        subFilter: SUBFILTER_ETSI_CADES_DETACHED,
      })
      return new SignPdf().sign(withPlaceholder, signer)
    },
  }
}

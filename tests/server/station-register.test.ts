/**
 * The licence register: a CSV uploaded into the object store (the local S3 fake), inspected,
 * previewed with a mapping (rejected rows by line), confirmed into a new register version;
 * re-imports make new versions and leave the older rows as they were; a calculation keeps its
 * copies; the store being down or the database refusing the row leaves nothing behind.
 */
import crypto from 'node:crypto'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { Readable } from 'node:stream'
import { GetObjectCommand, ListObjectsV2Command } from '@aws-sdk/client-s3'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { createObjectStore, type ObjectStore } from '../../server/storage/object-store'
import { storeStream } from '../../server/storage/stored-files'
import { stationReferences } from '../../server/modules/stations/station-references'
import { importRegisterStream } from '../../server/modules/stations/stations.service'
import { DEMO_REGISTER_FILE, DEMO_REGISTER_FILE_NAME, DEMO_REGISTER_MAPPING, DEMO_SCENARIO_STATION } from '../../ops/demo-data/station-register'
import {
  candidateRankingResponseSchema,
  csvInspectionResponseSchema,
  importConfirmResponseSchema,
  importPreviewResponseSchema,
  registerVersionResponseSchema,
  registerVersionsResponseSchema,
  stationResponseSchema,
  stationsPageResponseSchema,
  type ColumnMapping,
} from '../../shared/schemas/stations'
import { calculationResponseSchema } from '../../shared/schemas/views'
import { candidateSourcesOutputSchema } from '../../shared/calculations/kinds'
import { createTestContext, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestCase } from '../support/factories'

let fake: S3Fake
let store: ObjectStore
let t: TestContext
let down: TestContext
let admin: Agent
let investigator: Agent
let adminId: string
let worked: TestCase
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-register-s3-'))

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'register-test' })
  store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 64 * 1024 })
  t = await createTestContext({ objectStore: store })
  // a store nobody listens on: port 9 (discard) on loopback is closed
  down = await createTestContext({ objectStore: createObjectStore({ endpoint: 'http://127.0.0.1:9', region: 'us-east-1', bucket: 'nowhere', accessKeyId: 'x', secretAccessKey: 'y', forcePathStyle: true, maxUploadBytes: 1e6 }) })
  const a = await makeUser(t, { role: 'admin' })
  adminId = a.id
  admin = await signIn(t, a)
  const office = await makeOffice(t)
  worked = await makeCase(t, { office, state: 'field_work' })
  investigator = await signIn(t, worked.investigator!)
})
afterAll(async () => {
  await t?.close()
  await down?.close()
  await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

const sha256 = (b: Buffer | string) => crypto.createHash('sha256').update(b).digest('hex')
async function objectKeys(): Promise<string[]> {
  const r = await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket }))
  return (r.Contents ?? []).map((o) => o.Key!)
}
async function storedFileCount(ctx: TestContext): Promise<number> {
  const { rows } = await ctx.pool.query('SELECT count(*)::int AS n FROM stored_files')
  return rows[0].n
}
const upload = (agent: Agent, csv: string | Buffer, filename = 'register.csv') =>
  agent.post('/api/station-register/uploads').attach('file', Buffer.from(csv), { filename, contentType: 'text/csv' })

// A semicolon register in MHz and dBm: line 4 has three problems, line 5 an unknown unit.
const FIRST = [
  'Station code;Licensee;Service;Lat;Lon;Height (m);Low freq (MHz);High freq (MHz);EIRP (dBm)',
  'T-001;Alder Radio Club;PMR;47.70;-30.60;12;446.0;446.2;30',
  'T-002;Brackwater Links;Point-to-point;47.71;-30.61;25;7100;7128;55',
  'T-003;Cinder Taxis;PMR;47.72;-30.62;-5;446.3;446.1;abc',
  'T-004;Dunmore Haulage;PMR;47.73;-30.63;10;446.0;446.1;20 dBx',
].join('\n')

const FIRST_MAPPING: ColumnMapping = {
  fields: {
    stationCode: { column: 'Station code' },
    licensee: { column: 'Licensee' },
    service: { column: 'Service' },
    latitude: { column: 'Lat', unit: 'deg' },
    longitude: { column: 'Lon', unit: 'deg' },
    antennaHeight: { column: 'Height (m)', unit: 'm' },
    lowFreq: { column: 'Low freq (MHz)', unit: 'MHz' },
    highFreq: { column: 'High freq (MHz)', unit: 'MHz' },
    eirp: { column: 'EIRP (dBm)', unit: 'dBm' },
  },
}

// A comma register with centre and bandwidth, conducted power in watts, gain and feeder loss.
const SECOND = ['code,holder,centre_mhz,bw_khz,tx_power_w,gain_dbi,feeder_db,lat,lon', 'C-1,Alder Radio Club,446.1,200,10,6,1,47.70,-30.60', 'C-2,Elmstead Farms,446.15,100,0.5,2.15,0,47.75,-30.70'].join('\n')

async function importFile(csv: string, mapping: ColumnMapping, delimiter: 'comma' | 'semicolon') {
  const up = await upload(admin, csv).expect(201)
  const { inspection } = csvInspectionResponseSchema.parse(up.body)
  const res = await admin.post(`/api/station-register/uploads/${inspection.file.id}/confirm`).send({ delimiter, mapping }).expect(201)
  return { inspection, ...importConfirmResponseSchema.parse(res.body) }
}

describe('importing the register', () => {
  let fileId: string
  it('stores the upload in the object store with its SHA-256, then answers its headers, first rows and a suggested mapping', async () => {
    const before = await objectKeys()
    const res = await upload(admin, FIRST).expect(201)
    const { inspection } = csvInspectionResponseSchema.parse(res.body)
    fileId = inspection.file.id
    expectAnswerMatchesDocument('POST', '/api/station-register/uploads', res)
    expect(inspection.delimiter).toBe('semicolon')
    expect(inspection.delimiterDetected).toBe(true)
    expect(inspection.headers).toHaveLength(9)
    expect(inspection.sampleRows.map((r) => r.line)).toEqual([2, 3, 4, 5])
    expect(inspection.suggestedMapping).toEqual(FIRST_MAPPING)
    expect(inspection.file).toMatchObject({ originalName: 'register.csv', sizeBytes: Buffer.byteLength(FIRST), sha256: sha256(FIRST), contentType: 'text/csv', contentTypeSource: 'declared', purpose: 'station_register_import' })

    const { rows } = await t.pool.query('SELECT object_key, uploaded_by FROM stored_files WHERE id = $1', [fileId])
    expect(rows[0].uploaded_by).toBe(adminId)
    expect(await objectKeys()).toEqual(expect.arrayContaining([...before, rows[0].object_key]))
    const got = await store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: rows[0].object_key }))
    expect(sha256(Buffer.from(await got.Body!.transformToByteArray()))).toBe(sha256(FIRST))
  })

  it('previews every row with the mapping: rejected rows by line with every problem in them', async () => {
    const res = await admin.post(`/api/station-register/uploads/${fileId}/preview`).send({ delimiter: 'semicolon', mapping: FIRST_MAPPING }).expect(200)
    const { report } = importPreviewResponseSchema.parse(res.body)
    expectAnswerMatchesDocument('POST', '/api/station-register/uploads/:id/preview', res)
    expect(report).toMatchObject({ rowCount: 4, acceptedCount: 2, rejectedCount: 2 })
    expect(report.rejected.map((r) => r.line)).toEqual([4, 5])
    const [line4, line5] = report.rejected
    expect(line4!.problems).toHaveLength(3)
    expect(line4!.problems.join(' | ')).toMatch(/'-5' in column Height \(m\).*impossible/)
    expect(line4!.problems.join(' | ')).toMatch(/text 'abc' in column EIRP \(dBm\)/)
    expect(line4!.problems.join(' | ')).toMatch(/low frequency 446.3 MHz is not below the high frequency 446.1 MHz/)
    expect(line5!.problems).toEqual([expect.stringMatching(/unknown unit 'dBx' in column EIRP \(dBm\)/)])
    expect(report.sample[0]).toMatchObject({ line: 2, stationCode: 'T-001', lowFreqHz: 446_000_000, highFreqHz: 446_200_000, authorisedEirpDbm: 30, limit: { kind: 'eirp', eirpDbm: 30 } })
  })

  it('refuses a mapping naming columns the file does not have, and an incomplete mapping, listing every problem', async () => {
    const wrong = { fields: { ...FIRST_MAPPING.fields, licensee: { column: 'Holder' }, service: { column: 'Use' } } }
    const res = await admin.post(`/api/station-register/uploads/${fileId}/preview`).send({ delimiter: 'semicolon', mapping: wrong }).expect(400)
    expect(res.body.error.code).toBe('mapping_mismatch')
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['mapping.fields.licensee.column', 'mapping.fields.service.column'])

    const incomplete = { fields: { stationCode: { column: 'Station code' }, lowFreq: { column: 'Low freq (MHz)', unit: 'MHz' }, eirp: { column: 'EIRP (dBm)', unit: 'dBx' } } }
    const bad = await admin.post(`/api/station-register/uploads/${fileId}/preview`).send({ delimiter: 'semicolon', mapping: incomplete }).expect(400)
    const messages = bad.body.error.details.map((d: { message: string }) => d.message).join(' | ')
    expect(messages).toMatch(/licensee/)
    expect(messages).toMatch(/latitude/)
    expect(messages).toMatch(/Map both the low and the high frequency/)
    expect(messages).toMatch(/Unknown unit 'dBx'/)
  })

  it('confirms: a new register version with the accepted rows and the report; the current register lists them', async () => {
    const { rows: before } = await t.pool.query('SELECT coalesce(max(version), 0)::int AS v FROM station_register_versions')
    const res = await admin.post(`/api/station-register/uploads/${fileId}/confirm`).send({ delimiter: 'semicolon', mapping: FIRST_MAPPING }).expect(201)
    const { version, report } = importConfirmResponseSchema.parse(res.body)
    expectAnswerMatchesDocument('POST', '/api/station-register/uploads/:id/confirm', res)
    expect(version).toMatchObject({ version: before[0].v + 1, acceptedCount: 2, rejectedCount: 2, fileId, fileName: 'register.csv', sha256: sha256(FIRST), current: true, delimiter: 'semicolon', mapping: FIRST_MAPPING })
    expect(report.rejected.map((r) => r.line)).toEqual([4, 5])
    // the import is in the audit log, with its file and counts, in the same transaction (the list itself: audit.test.ts)
    const { rows: audit } = await t.pool.query(`SELECT actor_user_id, details FROM audit_log WHERE action = 'station_register.imported' AND target_id = $1`, [String(version.version)])
    expect(audit).toEqual([{ actor_user_id: adminId, details: { version: version.version, fileName: 'register.csv', sha256: sha256(FIRST), acceptedCount: 2, rejectedCount: 2 } }])

    const detail = registerVersionResponseSchema.parse((await investigator.get(`/api/station-register/versions/${version.version}`).expect(200)).body)
    expect(detail.rejected.map((r) => r.line)).toEqual([4, 5])
    const page = stationsPageResponseSchema.parse((await investigator.get('/api/station-register/stations').expect(200)).body)
    expect(page.registerVersion).toBe(version.version)
    expect(page.stations.map((s) => s.stationCode)).toEqual(['T-001', 'T-002'])
    const byFreq = stationsPageResponseSchema.parse((await investigator.get('/api/station-register/stations').query({ freq: '446.1 MHz' }).expect(200)).body)
    expect(byFreq.stations.map((s) => s.stationCode)).toEqual(['T-001'])
    const byText = stationsPageResponseSchema.parse((await investigator.get('/api/station-register/stations').query({ q: 'brackwater' }).expect(200)).body)
    expect(byText.stations.map((s) => s.stationCode)).toEqual(['T-002'])
    const one = stationResponseSchema.parse((await investigator.get(`/api/station-register/stations/${page.stations[0]!.id}`).expect(200)).body)
    expect(one.station).toMatchObject({ stationCode: 'T-001', latitudeDeg: 47.7, longitudeDeg: -30.6, antennaHeightM: 12, registerVersion: version.version })
  })

  it('a re-import makes a new version; the older version keeps its rows untouched; a stored calculation keeps its copies', async () => {
    const older = stationsPageResponseSchema.parse((await investigator.get('/api/station-register/stations').expect(200)).body)
    // a calculation ranked against the older version
    const inputs = { victimPosition: { latDeg: 47.7, lonDeg: -30.6 }, lowFreqHz: '446.05 MHz', highFreqHz: '446.15 MHz' }
    const stored = await investigator.post(`/api/cases/${worked.id}/calculations`).send({ kind: 'candidate_sources', inputs }).expect(201)
    const { calculation } = calculationResponseSchema.parse(stored.body)
    const value = candidateSourcesOutputSchema.parse(calculation.outputs.value)
    expect(value.registerVersion).toBe(older.registerVersion)
    expect(value.candidates.map((c) => c.stationCode)).toEqual(['T-001'])

    const second = await importFile(
      SECOND,
      {
        fields: {
          stationCode: { column: 'code' },
          licensee: { column: 'holder' },
          centreFreq: { column: 'centre_mhz', unit: 'MHz' },
          bandwidth: { column: 'bw_khz', unit: 'kHz' },
          conductedPower: { column: 'tx_power_w', unit: 'W' },
          antennaGain: { column: 'gain_dbi', unit: 'dBi' },
          feederLoss: { column: 'feeder_db', unit: 'dB' },
          latitude: { column: 'lat', unit: 'deg' },
          longitude: { column: 'lon', unit: 'deg' },
        },
      },
      'comma',
    )
    // the suggestion read the units from the headers (mhz, khz, w, dbi, db)
    expect(second.inspection.suggestedMapping.fields).toMatchObject({ centreFreq: { column: 'centre_mhz', unit: 'MHz' }, bandwidth: { column: 'bw_khz', unit: 'kHz' }, conductedPower: { column: 'tx_power_w', unit: 'W' } })
    expect(second.version.version).toBe(older.registerVersion! + 1)

    const now = stationsPageResponseSchema.parse((await investigator.get('/api/station-register/stations').expect(200)).body)
    expect(now.registerVersion).toBe(second.version.version)
    const c1 = now.stations.find((s) => s.stationCode === 'C-1')!
    // 446.1 MHz ± 100 kHz; 10 W = 10·log10(10 / 0.001) = 40 dBm; EIRP = 40 dBm − 1 dB feeder + 6 dBi = 45 dBm
    expect(c1).toMatchObject({ lowFreqHz: 446_000_000, highFreqHz: 446_200_000, antennaGainDbi: 6, feederLossDb: 1, limit: { kind: 'conducted', conductedPowerDbm: 40 } })
    expect(c1.authorisedEirpDbm).toBeCloseTo(45, 12)

    // the older version, read again: the same rows, the same values
    const again = stationsPageResponseSchema.parse((await investigator.get('/api/station-register/stations').query({ version: String(older.registerVersion) }).expect(200)).body)
    expect(again.stations).toEqual(older.stations)
    expect(await stationReferences(t.services.db, older.stations.map((s) => s.id))).toHaveLength(2)
    const versions = registerVersionsResponseSchema.parse((await investigator.get('/api/station-register/versions').expect(200)).body).versions
    expect(versions[0]).toMatchObject({ version: second.version.version, current: true })
    expect(versions.find((v) => v.version === older.registerVersion)).toMatchObject({ current: false })

    // the record still says what it said, and a recompute from its copies agrees
    const list = await investigator.get(`/api/cases/${worked.id}/calculations`).expect(200)
    const kept = list.body.calculations.find((c: { id: string }) => c.id === calculation.id)
    expect(kept.outputs).toEqual(calculation.outputs)
    expect(kept.references.stationRegister).toEqual({ version: older.registerVersion, overlappingCount: 1 })
    expect(kept.references.stations.map((s: { stationCode: string }) => s.stationCode)).toEqual(['T-001'])
    const recompute = await investigator.get(`/api/calculations/${calculation.id}/recompute`).expect(200)
    expect(recompute.body.recompute.differs).toBe(false)

    // ranked now, the new version's stations come up instead (C-1 at the victim's own position, within 1 m)
    const ranking = candidateRankingResponseSchema.parse((await investigator.post('/api/station-register/candidates').send(inputs).expect(200)).body).ranking
    expect(ranking.registerVersion).toBe(second.version.version)
    expect(ranking.candidates.map((c) => c.stationCode)).toEqual(['C-1', 'C-2'])
  })

  it('refuses confirming a file with no acceptable row, and keeps the register as it was', async () => {
    const { rows: before } = await t.pool.query('SELECT max(version)::int AS v FROM station_register_versions')
    const up = csvInspectionResponseSchema.parse((await upload(admin, FIRST.split('\n').filter((_l, i) => i === 0 || i >= 3).join('\n')).expect(201)).body)
    const res = await admin.post(`/api/station-register/uploads/${up.inspection.file.id}/confirm`).send({ delimiter: 'semicolon', mapping: FIRST_MAPPING }).expect(400)
    expect(res.body.error.code).toBe('no_rows_accepted')
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(['line 2', 'line 3'])
    const { rows: after } = await t.pool.query('SELECT max(version)::int AS v FROM station_register_versions')
    expect(after[0].v).toBe(before[0].v)
  })

  it('answers 400 for a file that is not a CSV or has no header, listing the problems', async () => {
    const binary = await upload(admin, Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x08, 0x00]), 'register.zip').expect(400)
    expect(binary.body.error).toMatchObject({ code: 'not_csv' })
    expect(binary.body.error.message).toMatch(/binary data/)
    const noHeader = await upload(admin, '1;2;3\n4;5;6\n').expect(400)
    expect(noHeader.body.error.code).toBe('not_csv')
    expect(noHeader.body.error.message).toMatch(/no column names/)
    const quote = await upload(admin, 'a,b\n"1,2\n').expect(400)
    expect(quote.body.error.code).toBe('not_csv')
    const notMultipart = await admin.post('/api/station-register/uploads').send({ file: 'x' }).expect(400)
    expect(notMultipart.body.error.code).toBe('not_multipart')
    // the form's delimiter field is read with its schema (registerUploadFieldsSchema): one of the list, or absent to detect it
    const badDelimiter = await upload(admin, FIRST).field('delimiter', 'pipe').expect(400)
    expect(badDelimiter.body.error).toMatchObject({ code: 'validation_failed', details: [{ path: 'delimiter', message: 'Choose the delimiter: comma, semicolon, tab or vertical bar.' }] })
    const chosen = csvInspectionResponseSchema.parse((await upload(admin, FIRST).field('delimiter', 'semicolon').expect(201)).body)
    expect(chosen.inspection).toMatchObject({ delimiter: 'semicolon', delimiterDetected: false })
  })

  it('refuses a file larger than the configured size (413) and keeps no row and no object for it', async () => {
    const rows = await storedFileCount(t)
    const keys = await objectKeys()
    const big = `a,b\n${'1,2\n'.repeat(20_000)}` // 80 kB > 64 kB
    const res = await upload(admin, big).expect(413)
    expect(res.body.error.code).toBe('file_too_large')
    expect(await storedFileCount(t)).toBe(rows)
    expect(await objectKeys()).toEqual(keys)
  })
})

describe('the storage service', () => {
  it('answers 503 storage_unavailable when the store is down, and writes no row', async () => {
    const downAdmin = await signIn(down, await makeUser(down, { role: 'admin' }))
    const rows = await storedFileCount(down)
    const res = await upload(downAdmin, FIRST).expect(503)
    expect(res.body.error.code).toBe('storage_unavailable')
    expect(await storedFileCount(down)).toBe(rows)
  })

  it('removes the stored object when the database refuses its row (no orphan object)', async () => {
    const keys = await objectKeys()
    const rows = await storedFileCount(t)
    // a purpose the database's CHECK refuses: the object is stored first, then the row fails
    const attempt = storeStream({ db: t.services.db, store }, Readable.from([Buffer.from('a,b\n1,2\n')]), { originalName: 'x.csv', contentType: 'text/csv', purpose: 'not-a-purpose' as never, uploadedBy: adminId })
    await expect(attempt).rejects.toThrow()
    expect(await storedFileCount(t)).toBe(rows)
    expect(await objectKeys()).toEqual(keys)
  })

  it('never reuses an object key: the same bytes stored twice are two objects', async () => {
    const a = await storeStream({ db: t.services.db, store }, Readable.from([Buffer.from('same')]), { originalName: 'a.csv', contentType: 'text/csv', purpose: 'station_register_import', uploadedBy: adminId })
    const b = await storeStream({ db: t.services.db, store }, Readable.from([Buffer.from('same')]), { originalName: 'a.csv', contentType: 'text/csv', purpose: 'station_register_import', uploadedBy: adminId })
    expect(a.objectKey).not.toBe(b.objectKey)
    expect(a.sha256).toBe(b.sha256)
    expect(a.sha256).toBe(sha256('same'))
  })
})

describe('the demo register', () => {
  it('imports through the same service as an upload: every row accepted, the scenario station at 30 dBm EIRP on 446.0–446.2 MHz', async () => {
    const { version, report } = await importRegisterStream({ db: t.services.db, pool: t.pool, objectStore: store }, adminId, fs.createReadStream(DEMO_REGISTER_FILE), {
      fileName: DEMO_REGISTER_FILE_NAME,
      delimiter: 'comma',
      mapping: DEMO_REGISTER_MAPPING,
    })
    expect(report.rejected).toEqual([])
    expect(report.acceptedCount).toBeGreaterThanOrEqual(300)
    expect(version).toMatchObject({ acceptedCount: report.acceptedCount, rejectedCount: 0, fileName: DEMO_REGISTER_FILE_NAME, sha256: sha256(fs.readFileSync(DEMO_REGISTER_FILE)), current: true })
    const page = stationsPageResponseSchema.parse((await investigator.get('/api/station-register/stations').query({ q: DEMO_SCENARIO_STATION.stationCode }).expect(200)).body)
    expect(page.stations).toHaveLength(1)
    // 0 dBW = 30 dBm (dBW + 30); 446.1 MHz ± 200 kHz / 2
    expect(page.stations[0]).toMatchObject({ ...DEMO_SCENARIO_STATION, limit: { kind: 'eirp', eirpDbm: 30 }, registerVersion: version.version })
  })
})

describe('who may do what', () => {
  it('lets staff read the register but only an administrator import; a refused upload stores nothing', async () => {
    const rows = await storedFileCount(t)
    const keys = await objectKeys()
    expect((await upload(investigator, FIRST).expect(403)).body.error.code).toBe('forbidden')
    const supervisor = await signIn(t, worked.supervisor!)
    await upload(supervisor, FIRST).expect(403)
    expect(await storedFileCount(t)).toBe(rows)
    expect(await objectKeys()).toEqual(keys)
    await supervisor.get('/api/station-register/versions').expect(200)
    const me = await investigator.get('/api/me').expect(200)
    expect(me.body.abilities).toMatchObject({ readStationRegister: true, importStationRegister: false })
    expect((await admin.get('/api/me').expect(200)).body.abilities).toMatchObject({ readStationRegister: true, importStationRegister: true })
  })
})

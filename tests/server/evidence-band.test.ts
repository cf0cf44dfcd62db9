/**
 * POST /api/evidence/:id/band: a JSON trace with a known flat level over a known band is stored
 * in the S3 fake, processed directly, and a band of its display trace is measured through the
 * route. Channel power and occupied bandwidth are checked against published arithmetic; bad
 * bands answer 400 listing every problem; another office 404, a complainant 403.
 *
 * POST /api/evidence/:id/band-measurement: the server measures the band itself and stores its
 * channel power as a measurement; the stored level is checked against a sum of the in-band
 * points done by hand in this file, and refusals (dBFS, no noise bandwidth, removed file, other
 * office, complainant, unassigned investigator) store nothing.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { Readable } from 'node:stream'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { createObjectStore, type ObjectStore } from '../../server/storage/object-store'
import { storeStream } from '../../server/storage/stored-files'
import { evidenceFiles } from '../../server/db/schema'
import { runEvidenceProcessing } from '../../server/modules/evidence/processing/process-evidence'
import { evidenceBandResponseSchema } from '../../shared/schemas/spectrum'
import { measurementResponseSchema, measurementsResponseSchema } from '../../shared/schemas/measurements'
import { bandMeasurementResponseSchema } from '../../shared/schemas/band-measurement'
import { RADIO_LIBRARY_VERSION } from '../../shared/radio'
import { cite } from '../fixtures/radio/check-row'
import { createTestContext, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeCase, makeOffice, makeUser, signIn, type TestCase, type TestUser } from '../support/factories'

let fake: S3Fake
let store: ObjectStore
let t: TestContext
let worked: TestCase
let staff: TestUser
let supervisor: TestUser
let evidenceId: string
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-evidence-band-s3-'))

/**
 * 401 points from 100 to 104 MHz, 10 kHz apart, each read in a 100 kHz noise bandwidth:
 * −60 dBm from 101.0 to 103.0 MHz, −90 dBm elsewhere.
 */
const freqHz = Array.from({ length: 401 }, (_, i) => 100e6 + i * 1e4)
const levelDbm = freqHz.map((f) => (f >= 101e6 && f <= 103e6 ? -60 : -90))
const ENBW_HZ = 1e5

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'band-test' })
  store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 8 * 1024 * 1024 })
  t = await createTestContext({ objectStore: store })
  const office = await makeOffice(t)
  worked = await makeCase(t, { office, state: 'field_work' })
  staff = await makeUser(t, { role: 'investigator', office })
  supervisor = await makeUser(t, { role: 'supervisor', office })
  const body = Buffer.from(JSON.stringify({ freqHz, levelDbm, enbwHz: ENBW_HZ }))
  const file = await storeStream({ db: t.services.db, store }, Readable.from([body]), { originalName: 'flat.json', contentType: 'application/json', purpose: 'evidence', uploadedBy: staff.id })
  const [e] = await t.services.db
    .insert(evidenceFiles)
    .values({ caseId: worked.id, storedFileId: file.id, kind: 'spectrum_capture', uploaderRole: 'staff', uploaderUserId: staff.id, displayName: 'flat.json', submittedNameJson: JSON.stringify('flat.json') })
    .returning({ id: evidenceFiles.id })
  evidenceId = e!.id
  await runEvidenceProcessing({ db: t.services.db, objectStore: store }, evidenceId)
})
afterAll(async () => {
  await t?.close()
  await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

describe('POST /api/evidence/:id/band', () => {
  it(`gives the channel power of a flat 1 MHz band: ${cite('Keysight Application Note 150, Spectrum Analysis Basics, ch. 5', '14-3')} [D]`, async () => {
    const agent = await signIn(t, staff)
    const res = await agent.post(`/api/evidence/${evidenceId}/band`).send({ lowFreqHz: 101.5e6, highFreqHz: 102.5e6 })
    expect(res.status, res.text).toBe(200)
    const band = evidenceBandResponseSchema.parse(res.body).band
    expectAnswerMatchesDocument('POST', '/api/evidence/:id/band', res)
    // P_ch = P_read − 10·log10(B_N) + 10·log10(B_ch) = −60 − 50 + 60 = −50.00 dBm
    // (level density −60 dBm / 100 kHz = −110 dBm/Hz, times 1 MHz)
    expect(band.levelUnit).toBe('dBm')
    expect(band.channelPowerDbm).toBeCloseTo(-60 - 10 * Math.log10(ENBW_HZ) + 10 * Math.log10(1e6), 9)
    expect(band.channelPowerDbm).toBeCloseTo(-50, 9)
    expect(band.channelPowerDbfs).toBeNull()
    expect(band.channelPowerNote).toBeNull()
    // a flat spectrum of width B has an occupied bandwidth of 0.99·B (ITU RR No. 1.153, β/2 = 0.5 % each side) [D]
    expect(band.occupiedBandwidthHz).toBeCloseTo(0.99 * 1e6, 3)
    expect(band.occupiedLowerEdgeHz).toBeCloseTo(101.5e6 + 0.005e6, 3)
    expect(band.basis).toEqual({ trace: 'display', pointCount: 401, pointsInBand: 100, decimated: false, sourcePointCount: 401, binSpacingHz: 1e4, enbwHz: ENBW_HZ })
    expect(band.warnings[0]).toMatch(/display trace \(401 points, about 1\.000e\+4 Hz apart\)/)
    expect(band.methods.map((m) => m.id)).toEqual(['channel-power-enbw', 'occupied-bandwidth-beta2'])
    expect(band.libraryVersion).toBe(RADIO_LIBRARY_VERSION)
  })

  it('reads edges written with their unit the same as numbers of hertz', async () => {
    const agent = await signIn(t, staff)
    const res = await agent.post(`/api/evidence/${evidenceId}/band`).send({ lowFreqHz: '101.5 MHz', highFreqHz: '102500 kHz' })
    expect(res.status, res.text).toBe(200)
    const band = evidenceBandResponseSchema.parse(res.body).band
    expect([band.lowFreqHz, band.highFreqHz]).toEqual([101.5e6, 102.5e6])
    expect(band.channelPowerDbm).toBeCloseTo(-50, 9)
  })

  it('refuses bad bands with a 400 listing every problem', async () => {
    const agent = await signIn(t, staff)
    const post = (body: unknown) => agent.post(`/api/evidence/${evidenceId}/band`).send(body as object)
    const paths = (res: { body: { error: { details: { path: string }[] } } }) => res.body.error.details.map((d) => d.path).sort()

    const reversed = await post({ lowFreqHz: 102e6, highFreqHz: 101e6 })
    expect(reversed.status).toBe(400)
    expect(reversed.body.error.code).toBe('validation_failed')
    expect(reversed.body.error.details).toEqual([{ path: 'highFreqHz', message: 'The high edge of the band must be above its low edge.' }])

    const equal = await post({ lowFreqHz: 102e6, highFreqHz: 102e6 })
    expect(equal.status).toBe(400)

    const outside = await post({ lowFreqHz: 90e6, highFreqHz: 110e6 })
    expect(outside.status).toBe(400)
    expect(paths(outside)).toEqual(['highFreqHz', 'lowFreqHz'])
    expect(outside.body.error.details[0].message).toMatch(/outside the trace: the trace runs from 99\.995 MHz to 104\.005 MHz/)

    const noUnit = await post({ lowFreqHz: '101.5', highFreqHz: '102.5' })
    expect(noUnit.status).toBe(400)
    expect(paths(noUnit)).toEqual(['highFreqHz', 'lowFreqHz'])
    expect(noUnit.body.error.details[0].message).toMatch(/Write the unit/)

    const missing = await post({})
    expect(missing.status).toBe(400)
    expect(paths(missing)).toEqual(['highFreqHz', 'lowFreqHz'])

    const wrongUnit = await post({ lowFreqHz: '101.5 dBm', highFreqHz: 102.5e6 })
    expect(wrongUnit.status).toBe(400)
    expect(paths(wrongUnit)).toEqual(['lowFreqHz'])
  })

  it('accepts a band’s figure typed into the measurements route by hand, linked to its file of the same case', async () => {
    // the office's supervisor may record measurements on any case of the office
    const agent = await signIn(t, supervisor)
    const band = evidenceBandResponseSchema.parse((await agent.post(`/api/evidence/${evidenceId}/band`).send({ lowFreqHz: 101.5e6, highFreqHz: 102.5e6 })).body).band
    const res = await agent.post(`/api/cases/${worked.id}/measurements`).send({
      measurement: {
        takenAt: '2026-11-20T09:00:00.000Z',
        latDeg: 48.1,
        lonDeg: -31.35,
        freqHz: `${(band.lowFreqHz + band.highFreqHz) / 2} Hz`,
        measurementBandwidthHz: `${band.highFreqHz - band.lowFreqHz} Hz`,
        reading: { unit: 'dBm', value: `${band.channelPowerDbm} dBm` },
        evidenceFileId: evidenceId,
        notes: 'Channel power computed on the display trace.',
      },
    })
    expect(res.status, res.text).toBe(201)
    const m = measurementResponseSchema.parse(res.body).measurement
    expect(m.freqHz).toBe(102e6)
    expect(m.measurementBandwidthHz).toBe(1e6)
    expect(m.reading.unit).toBe('dBm')
    expect(m.reading.value).toBeCloseTo(-50, 9)
    expect(m.evidenceFileId).toBe(evidenceId)
  })

  it('answers 404 to another office (and to an id that is no uuid) and 403 to a complainant', async () => {
    const body = { lowFreqHz: 101.5e6, highFreqHz: 102.5e6 }
    const other = await signIn(t, await makeUser(t, { role: 'investigator', office: await makeOffice(t) }))
    const far = await other.post(`/api/evidence/${evidenceId}/band`).send(body)
    expect(far.status).toBe(404)
    expect(far.body.error.code).toBe('evidence_not_found')
    expect((await other.post('/api/evidence/not-a-uuid/band').send(body)).status).toBe(404)
    const complainant = await signIn(t, await makeUser(t, { role: 'complainant' }))
    expect((await complainant.post(`/api/evidence/${evidenceId}/band`).send(body)).status).toBe(403)
  })
})

// ---- a band kept as a measurement, computed by the server --------------------------------------

/** One ustar header block (POSIX.1-2008 ustar layout). */
function tarHeader(name: string, size: number): Buffer {
  const h = Buffer.alloc(512)
  h.write(name, 0, 100, 'utf8')
  h.write('0000644\0', 100, 'ascii')
  h.write('0000000\0', 108, 'ascii')
  h.write('0000000\0', 116, 'ascii')
  h.write(size.toString(8).padStart(11, '0') + '\0', 124, 'ascii')
  h.write('00000000000\0', 136, 'ascii')
  h.write('        ', 148, 'ascii')
  h.write('0', 156, 'ascii')
  h.write('ustar\0', 257, 'ascii')
  h.write('00', 263, 'ascii')
  let sum = 0
  for (const b of h) sum += b
  h.write(sum.toString(8).padStart(6, '0') + '\0 ', 148, 'ascii')
  return h
}
const tar = (members: { name: string; body: Buffer }[]) =>
  Buffer.concat([...members.flatMap((m) => [tarHeader(m.name, m.body.length), m.body, Buffer.alloc((512 - (m.body.length % 512)) % 512)]), Buffer.alloc(1024)])

/** An uncalibrated SigMF recording (cf32_le, a tone at a quarter of the rate): analysed in dBFS. */
function dbfsRecording(): Buffer {
  const n = 8192
  const x = new Float32Array(2 * n)
  for (let i = 0; i < n; i++) {
    x[2 * i] = 0.1 * Math.cos((Math.PI / 2) * i)
    x[2 * i + 1] = 0.1 * Math.sin((Math.PI / 2) * i)
  }
  const meta = { global: { 'core:datatype': 'cf32_le', 'core:version': '1.2.6', 'core:sample_rate': 1e6 }, captures: [{ 'core:sample_start': 0, 'core:frequency': 433.92e6 }], annotations: [] }
  return tar([
    { name: 'u/u.sigmf-meta', body: Buffer.from(JSON.stringify(meta)) },
    { name: 'u/u.sigmf-data', body: Buffer.from(x.buffer) },
  ])
}

/**
 * 100 points from 200.00 to 200.99 MHz, 10 kHz apart, each read in a 10 kHz noise bandwidth
 * (so each cell is exactly one noise bandwidth wide), with levels that differ point to point.
 */
const VARIED_FREQ_HZ = Array.from({ length: 100 }, (_, i) => 200e6 + i * 1e4)
const VARIED_LEVEL_DBM = VARIED_FREQ_HZ.map((_, i) => Math.round((-85 + 25 * Math.exp(-(((i - 40) / 6) ** 2)) + 3 * Math.sin(i * 1.7)) * 100) / 100)
const VARIED_ENBW_HZ = 1e4
/** Band edges on the cell boundaries (midpoints): points 31 to 50 (200.31 … 200.50 MHz) lie wholly inside. */
const BAND = { lowFreqHz: 200.305e6, highFreqHz: 200.505e6 }

describe('POST /api/evidence/:id/band-measurement', () => {
  let bandCase: TestCase
  let assigned: TestUser
  let varied: string
  let dbfs: string
  let noEnbw: string

  async function addEvidence(caseId: string, body: Buffer, name: string, contentType: string, kind: 'spectrum_capture' | 'iq_recording', process = true): Promise<string> {
    const file = await storeStream({ db: t.services.db, store }, Readable.from([body]), { originalName: name, contentType, purpose: 'evidence', uploadedBy: assigned.id })
    const [e] = await t.services.db
      .insert(evidenceFiles)
      .values({ caseId, storedFileId: file.id, kind, uploaderRole: 'staff', uploaderUserId: assigned.id, displayName: name, submittedNameJson: JSON.stringify(name) })
      .returning({ id: evidenceFiles.id })
    if (process) await runEvidenceProcessing({ db: t.services.db, objectStore: store }, e!.id)
    return e!.id
  }

  const whenWhere = { takenAt: '2026-11-21T14:30:00.000Z', latDeg: 48.1234, lonDeg: -31.4321 }
  const measurementsOf = async (agent: Awaited<ReturnType<typeof signIn>>, caseId: string) => measurementsResponseSchema.parse((await agent.get(`/api/cases/${caseId}/measurements`)).body).measurements

  beforeAll(async () => {
    assigned = await makeUser(t, { role: 'investigator', office: worked.office })
    bandCase = await makeCase(t, { office: worked.office, state: 'field_work', investigator: assigned, supervisor })
    varied = await addEvidence(bandCase.id, Buffer.from(JSON.stringify({ freqHz: VARIED_FREQ_HZ, levelDbm: VARIED_LEVEL_DBM, enbwHz: VARIED_ENBW_HZ })), 'varied.json', 'application/json', 'spectrum_capture')
    dbfs = await addEvidence(bandCase.id, dbfsRecording(), 'uncalibrated.sigmf', 'application/x-tar', 'iq_recording')
    noEnbw = await addEvidence(bandCase.id, Buffer.from('Frequency (MHz),Level (dBm)\n' + VARIED_FREQ_HZ.map((f, i) => `${f / 1e6},${VARIED_LEVEL_DBM[i]}`).join('\n')), 'no-rbw.csv', 'text/csv', 'spectrum_capture')
  })

  it('reads the noise bandwidth a CSV trace states on an "# ENBW:" line, and stores the same channel power as the JSON trace', async () => {
    const csv = `# ENBW: ${VARIED_ENBW_HZ / 1e3} kHz\nFrequency (MHz),Level (dBm)\n` + VARIED_FREQ_HZ.map((f, i) => `${f / 1e6},${VARIED_LEVEL_DBM[i]}`).join('\n')
    const withEnbw = await addEvidence(bandCase.id, Buffer.from(csv), 'with-enbw.csv', 'text/csv', 'spectrum_capture')
    const agent = await signIn(t, assigned)
    const fromCsv = await agent.post(`/api/evidence/${withEnbw}/band-measurement`).send({ ...BAND, ...whenWhere })
    expect(fromCsv.status, fromCsv.text).toBe(201)
    // the same points summed by hand, as in the JSON case below (common practice, no source)
    let sumMw = 0
    for (const l of VARIED_LEVEL_DBM.slice(31, 51)) sumMw += Math.pow(10, l / 10)
    expect(fromCsv.body.measurement.reading.value).toBeCloseTo(10 * Math.log10(sumMw), 9)
    expect(fromCsv.body.band.basis.enbwHz).toBe(VARIED_ENBW_HZ)
  })

  it(`stores the band's channel power as the reading, equal to the in-band points summed by hand: ${cite('Keysight Application Note 150, Spectrum Analysis Basics, ch. 5', '14-1')} [D]`, async () => {
    const agent = await signIn(t, assigned)
    // a page that sends its own level, frequency and method: none of them is read
    const res = await agent.post(`/api/evidence/${varied}/band-measurement`).send({
      ...BAND,
      ...whenWhere,
      notes: 'Band of the carrier seen from the harbour wall.',
      channelPowerDbm: 0,
      reading: { unit: 'dBm', value: '0 dBm' },
      freqHz: 1e6,
      methods: { reading: { id: 'typed', source: 'the page' } },
    })
    expect(res.status, res.text).toBe(201)
    const body = bandMeasurementResponseSchema.parse(res.body)
    expectAnswerMatchesDocument('POST', '/api/evidence/:id/band-measurement', res)
    // nothing the schema does not declare is in the answer
    expect(body).toEqual(res.body)
    const m = body.measurement

    // Independent sum: the points wholly inside the band are 31..50; each cell is one noise
    // bandwidth wide (Δf = ENBW = 10 kHz), so the channel power is the sum of their powers in
    // linear mW (summing powers of uncorrelated noise-like cells: common practice, no source).
    const inBand = VARIED_LEVEL_DBM.slice(31, 51)
    expect(VARIED_FREQ_HZ.slice(31, 51).every((f) => f > BAND.lowFreqHz && f < BAND.highFreqHz)).toBe(true)
    expect(VARIED_FREQ_HZ[30]! < BAND.lowFreqHz && VARIED_FREQ_HZ[51]! > BAND.highFreqHz).toBe(true)
    let sumMw = 0
    for (const l of inBand) sumMw += Math.pow(10, l / 10)
    const expectedDbm = 10 * Math.log10(sumMw)
    expect(m.reading.unit).toBe('dBm')
    expect(m.reading.value).toBeCloseTo(expectedDbm, 9)
    expect(m.reading.value).not.toBe(0)
    expect(m.reading.value).toBe(body.band.channelPowerDbm)

    // centre and width of the band; when and where as typed; the file linked
    expect(m.freqHz).toBeCloseTo(200.405e6, 3)
    expect(m.measurementBandwidthHz).toBeCloseTo(0.2e6, 3)
    expect(m.takenAt).toBe(whenWhere.takenAt)
    expect([m.latDeg, m.lonDeg]).toEqual([48.1234, -31.4321])
    expect(m.evidenceFileId).toBe(varied)
    expect(m.antenna).toEqual({ source: 'none' })
    expect(m.author).toBe(assigned.name)

    // how it was made: the method, the basis and the library version
    expect(m.methods.reading).toEqual({ id: 'channel-power-enbw', source: expect.stringMatching(/Keysight AN 150/) })
    expect(m.libraryVersion).toBe(RADIO_LIBRARY_VERSION)
    expect(m.notes).toMatch(/^Band of the carrier seen from the harbour wall\.\n\n/)
    expect(m.notes).toContain('Channel power of varied.json from 200.305 MHz to 200.505 MHz, computed by the server on the file\'s display trace (100 points, 1.000e+4 Hz apart, not decimated, noise bandwidth (ENBW) 10000 Hz, 20.00 points in the band)')
    expect(m.notes).toContain(`radio library ${RADIO_LIBRARY_VERSION}`)
    expect(m.warnings[0]).toMatch(/^Computed on the display trace \(100 points/)
    expect(m.warnings.some((w) => w.startsWith('Occupied bandwidth'))).toBe(false)

    // and the case's list shows it as stored
    const listed = (await measurementsOf(agent, bandCase.id)).find((x) => x.id === m.id)
    expect(listed?.reading.value).toBe(m.reading.value)
    expect(listed?.evidenceFileId).toBe(varied)
  })

  it('reads edges and position written with their units, as the measurement form sends them', async () => {
    const agent = await signIn(t, supervisor)
    const res = await agent.post(`/api/evidence/${varied}/band-measurement`).send({ lowFreqHz: '200.305 MHz', highFreqHz: '200505 kHz', ...whenWhere, latDeg: '48.1234', lonDeg: '-31.4321' })
    expect(res.status, res.text).toBe(201)
    const m = bandMeasurementResponseSchema.parse(res.body).measurement
    let sumMw = 0
    for (const l of VARIED_LEVEL_DBM.slice(31, 51)) sumMw += Math.pow(10, l / 10)
    expect(m.reading.value).toBeCloseTo(10 * Math.log10(sumMw), 9)
    expect(m.notes).not.toMatch(/\n\n/)
  })

  it('refuses a dBFS trace and a trace without its noise bandwidth (409), storing nothing', async () => {
    const agent = await signIn(t, assigned)
    const before = (await measurementsOf(agent, bandCase.id)).length

    const uncal = await agent.post(`/api/evidence/${dbfs}/band-measurement`).send({ lowFreqHz: 433.9e6, highFreqHz: 434.1e6, ...whenWhere })
    expect(uncal.status, uncal.text).toBe(409)
    expect(uncal.body.error.code).toBe('trace_not_calibrated')
    expect(uncal.body.error.message).toMatch(/dBFS/)
    // the same band is measured (in dBFS) by the band route: the refusal is about the unit only
    const asBand = evidenceBandResponseSchema.parse((await agent.post(`/api/evidence/${dbfs}/band`).send({ lowFreqHz: 433.9e6, highFreqHz: 434.1e6 })).body).band
    expect(asBand.levelUnit).toBe('dBFS')
    expect(asBand.channelPowerDbfs).not.toBeNull()

    const noRbw = await agent.post(`/api/evidence/${noEnbw}/band-measurement`).send({ ...BAND, ...whenWhere })
    expect(noRbw.status, noRbw.text).toBe(409)
    expect(noRbw.body.error.code).toBe('channel_power_unavailable')
    expect(noRbw.body.error.message).toMatch(/noise bandwidth \(RBW\)/)

    expect((await measurementsOf(agent, bandCase.id)).length).toBe(before)
  })

  it('answers 400 listing every problem of the body', async () => {
    const agent = await signIn(t, assigned)
    const res = await agent.post(`/api/evidence/${varied}/band-measurement`).send({ lowFreqHz: '200.5', highFreqHz: 200.3e6, takenAt: 'yesterday', latDeg: 95, lonDeg: '-31.4 MHz' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect([...new Set(res.body.error.details.map((d: { path: string }) => d.path))].sort()).toEqual(['latDeg', 'lonDeg', 'lowFreqHz', 'takenAt'])
    const reversed = await agent.post(`/api/evidence/${varied}/band-measurement`).send({ lowFreqHz: 200.5e6, highFreqHz: 200.3e6, ...whenWhere })
    expect(reversed.status).toBe(400)
    expect(reversed.body.error.details).toEqual([{ path: 'highFreqHz', message: 'The high edge of the band must be above its low edge.' }])
    const outside = await agent.post(`/api/evidence/${varied}/band-measurement`).send({ lowFreqHz: 199e6, highFreqHz: 200.5e6, ...whenWhere })
    expect(outside.status).toBe(400)
    expect(outside.body.error.details.map((d: { path: string }) => d.path)).toEqual(['lowFreqHz'])
  })

  it('answers 404 to another office, 403 to a complainant and to an investigator not assigned to the case, 409 for a removed file', async () => {
    const body = { ...BAND, ...whenWhere }
    const other = await signIn(t, await makeUser(t, { role: 'investigator', office: await makeOffice(t) }))
    const far = await other.post(`/api/evidence/${varied}/band-measurement`).send(body)
    expect(far.status).toBe(404)
    expect(far.body.error.code).toBe('evidence_not_found')
    const complainant = await signIn(t, await makeUser(t, { role: 'complainant' }))
    expect((await complainant.post(`/api/evidence/${varied}/band-measurement`).send(body)).status).toBe(403)
    // the office's other investigator may read the file and measure a band, but not record on a case not theirs
    const notAssigned = await signIn(t, staff)
    expect((await notAssigned.post(`/api/evidence/${varied}/band`).send(BAND)).status).toBe(200)
    const refused = await notAssigned.post(`/api/evidence/${varied}/band-measurement`).send(body)
    expect(refused.status).toBe(403)

    const agent = await signIn(t, assigned)
    const count = (await measurementsOf(agent, bandCase.id)).length
    const copy = await addEvidence(bandCase.id, Buffer.from(JSON.stringify({ freqHz: VARIED_FREQ_HZ, levelDbm: VARIED_LEVEL_DBM, enbwHz: VARIED_ENBW_HZ })), 'copy.json', 'application/json', 'spectrum_capture')
    const removed = await (await signIn(t, supervisor)).post(`/api/evidence/${copy}/remove`).send({ reason: 'Uploaded twice.' })
    expect(removed.status, removed.text).toBe(200)
    const gone = await agent.post(`/api/evidence/${copy}/band-measurement`).send(body)
    expect(gone.status).toBe(409)
    expect(gone.body.error.code).toBe('evidence_removed')
    expect((await measurementsOf(agent, bandCase.id)).length).toBe(count)
  })

  it('answers 409 while the case is not being worked (the rule for recording measurements), storing nothing', async () => {
    const proposed = await makeCase(t, { office: worked.office, state: 'finding_proposed', investigator: assigned, supervisor })
    const id = await addEvidence(proposed.id, Buffer.from(JSON.stringify({ freqHz: VARIED_FREQ_HZ, levelDbm: VARIED_LEVEL_DBM, enbwHz: VARIED_ENBW_HZ })), 'late.json', 'application/json', 'spectrum_capture')
    const agent = await signIn(t, assigned)
    const res = await agent.post(`/api/evidence/${id}/band-measurement`).send({ ...BAND, ...whenWhere })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('invalid_state')
    expect(await measurementsOf(agent, proposed.id)).toEqual([])
  })

  it('links a file to a measurement typed by hand only when it is a file of the same case, not removed', async () => {
    const agent = await signIn(t, supervisor)
    const typed = (evidenceFileId: string) => ({
      measurement: { takenAt: '2026-11-20T09:00:00.000Z', latDeg: 48.1, lonDeg: -31.35, freqHz: '102 MHz', reading: { unit: 'dBm', value: '-50 dBm' }, evidenceFileId },
    })
    // a file of another case of the same office
    const res = await agent.post(`/api/cases/${worked.id}/measurements`).send(typed(varied))
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([{ path: 'measurement.evidenceFileId', message: `There is no evidence file ${varied} on this case.` }])
    const unknown = await agent.post(`/api/cases/${worked.id}/measurements`).send(typed('00000000-0000-4000-8000-000000000000'))
    expect(unknown.status).toBe(400)
    expect((await agent.post(`/api/cases/${bandCase.id}/measurements`).send(typed(varied))).status).toBe(201)
  })
})

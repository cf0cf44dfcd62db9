/**
 * POST /api/evidence/:id/band: a JSON trace with a known flat level over a known band is stored
 * in the S3 fake, processed directly, and a band of its display trace is measured through the
 * route. Channel power and occupied bandwidth are checked against published arithmetic; bad
 * bands answer 400 listing every problem; another office 404, a complainant 403.
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
import { measurementResponseSchema } from '../../shared/schemas/measurements'
import { RADIO_LIBRARY_VERSION } from '../../shared/radio'
import { cite } from '../fixtures/radio/check-row'
import { createTestContext, type TestContext } from '../support/harness'
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

  it('keeps a band of a dBm trace as a measurement of the case, in the shape the spectrum view sends', async () => {
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

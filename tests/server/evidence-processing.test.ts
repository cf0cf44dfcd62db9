/**
 * The processing of spectrum evidence: a SigMF archive (a tar of .sigmf-meta and cf32_le
 * .sigmf-data, a seeded tone, a burst and noise) and a CSV trace are stored in the S3 fake,
 * then analysed by the processing function directly and through the queue; the same recording
 * uploaded as its two files (either order, or at once) is paired and analysed on its dataset;
 * malformed files end as recorded failures with their reason; the sweep queues again what a
 * crash left unprocessed; GET /api/evidence/:id/analysis answers staff of
 * the office (view schema checked) and 404 to another office.
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
import { findAnalysis, markAnalysisQueued } from '../../server/modules/evidence/processing/analyses.repo'
import { requeueStrandedProcessing } from '../../server/modules/evidence/processing-sweep'
import { EVIDENCE_PROCESSING_QUEUE, queueEvidenceProcessing, startEvidenceProcessingWorker, type EvidenceProcessingWorker } from '../../server/modules/evidence/processing-queue'
import { evidenceAnalysisResponseSchema } from '../../shared/schemas/spectrum'
import { RADIO_LIBRARY_VERSION } from '../../shared/radio'
import { createNormalSource, createUniformSource } from '../../shared/radio/uncertainty/prng'
import { createTestContext, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestCase, type TestUser } from '../support/factories'

let fake: S3Fake
let store: ObjectStore
let t: TestContext
let worked: TestCase
let staff: TestUser
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-evidence-processing-s3-'))

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'processing-test' })
  store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 64 * 1024 * 1024 })
  t = await createTestContext({ objectStore: store })
  const office = await makeOffice(t)
  worked = await makeCase(t, { office })
  staff = await makeUser(t, { role: 'investigator', office })
})
afterAll(async () => {
  await t?.close()
  await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

// ---- test files ------------------------------------------------------------------------------

/** One ustar header block (POSIX.1-2008 ustar layout) for a file or directory. */
function tarHeader(name: string, size: number, type: '0' | '5' | '2' = '0'): Buffer {
  const h = Buffer.alloc(512)
  h.write(name, 0, 100, 'utf8')
  h.write('0000644\0', 100, 'ascii')
  h.write('0000000\0', 108, 'ascii')
  h.write('0000000\0', 116, 'ascii')
  h.write(size.toString(8).padStart(11, '0') + '\0', 124, 'ascii')
  h.write('00000000000\0', 136, 'ascii')
  h.write('        ', 148, 'ascii')
  h.write(type, 156, 'ascii')
  h.write('ustar\0', 257, 'ascii')
  h.write('00', 263, 'ascii')
  let sum = 0
  for (const b of h) sum += b
  h.write(sum.toString(8).padStart(6, '0') + '\0 ', 148, 'ascii')
  return h
}

function tar(members: { name: string; body: Buffer; type?: '0' | '5' | '2' }[]): Buffer {
  const parts: Buffer[] = []
  for (const m of members) {
    parts.push(tarHeader(m.name, m.body.length, m.type), m.body, Buffer.alloc((512 - (m.body.length % 512)) % 512))
  }
  parts.push(Buffer.alloc(1024))
  return Buffer.concat(parts)
}

const FS_HZ = 1e6
const CENTER_HZ = 433.92e6
const SAMPLES = 2 ** 17
const TONE_OFFSET_HZ = 125e3 // 512 bins of 4096 and 64 columns of 512: bin-centred
const BURST_OFFSET_HZ = -250e3 // last quarter of the recording only
const BURST_FROM = (3 * SAMPLES) / 4

/** cf32_le: a tone A = 0.1 (−20 dBFS), a burst A = 0.05 in the last quarter, noise 1e-4 FS² (seeded). */
function toneRecording(): Buffer {
  const g = createNormalSource(createUniformSource(20261205))
  const sd = Math.sqrt(1e-4 / 2)
  const x = new Float32Array(2 * SAMPLES)
  for (let n = 0; n < SAMPLES; n++) {
    const ph = (2 * Math.PI * TONE_OFFSET_HZ * n) / FS_HZ
    let re = 0.1 * Math.cos(ph) + sd * g()
    let im = 0.1 * Math.sin(ph) + sd * g()
    if (n >= BURST_FROM) {
      const pb = (2 * Math.PI * BURST_OFFSET_HZ * n) / FS_HZ
      re += 0.05 * Math.cos(pb)
      im += 0.05 * Math.sin(pb)
    }
    x[2 * n] = re
    x[2 * n + 1] = im
  }
  return Buffer.from(x.buffer)
}

const BURST_ANNOTATION = { 'core:sample_start': BURST_FROM, 'core:sample_count': SAMPLES / 4, 'core:label': 'burst' }
const sigmfMeta = (over: Record<string, unknown> = {}, annotations: unknown[] = [BURST_ANNOTATION]) =>
  Buffer.from(
    JSON.stringify({
      global: { 'core:datatype': 'cf32_le', 'core:version': '1.2.6', 'core:sample_rate': FS_HZ, ...over },
      captures: [{ 'core:sample_start': 0, 'core:frequency': CENTER_HZ }],
      annotations,
    }),
  )

/** Stores the bytes through storeStream (S3 fake) and adds them to the case as evidence. */
async function addEvidence(body: Buffer, originalName: string, contentType: string, kind: 'iq_recording' | 'spectrum_capture'): Promise<string> {
  // a small highWaterMark: the object goes up in several chunks, as a real upload does
  const file = await storeStream({ db: t.services.db, store }, Readable.from(chunks(body, 100_000)), { originalName, contentType, purpose: 'evidence', uploadedBy: staff.id })
  const [e] = await t.services.db
    .insert(evidenceFiles)
    .values({ caseId: worked.id, storedFileId: file.id, kind, uploaderRole: 'staff', uploaderUserId: staff.id, displayName: originalName, submittedNameJson: JSON.stringify(originalName) })
    .returning({ id: evidenceFiles.id })
  return e!.id
}

function* chunks(b: Buffer, size: number) {
  for (let at = 0; at < b.length; at += size) yield b.subarray(at, at + size)
}

const deps = () => ({ db: t.services.db, objectStore: store })
const decodeCells = (b64: string) => new Uint8Array(Buffer.from(b64, 'base64'))

// ---- the recording ---------------------------------------------------------------------------

describe('a SigMF archive (cf32_le tone + burst + noise) processed directly', () => {
  let evidenceId: string
  beforeAll(async () => {
    const data = toneRecording()
    evidenceId = await addEvidence(
      tar([
        { name: 'tone/', body: Buffer.alloc(0), type: '5' },
        { name: 'tone/tone.sigmf-meta', body: sigmfMeta() },
        { name: 'tone/tone.sigmf-data', body: data },
      ]),
      'tone.sigmf',
      'application/x-tar',
      'iq_recording',
    )
    await runEvidenceProcessing(deps(), evidenceId)
  })

  it('records the analysis as done with the library version, mirrored on the file row', async () => {
    const a = await findAnalysis(t.services.db, evidenceId)
    expect(a?.message).toBeNull()
    expect(a?.state).toBe('done')
    expect(a?.progress).toBe(1)
    expect(a?.libraryVersion).toBe(RADIO_LIBRARY_VERSION)
    const { rows } = await t.pool.query('SELECT processing FROM evidence_files WHERE id = $1', [evidenceId])
    expect(rows[0].processing).toEqual({ state: 'done', progress: 1 })
  })

  it('summarises the recording: rate, centre, duration, captures and annotations', async () => {
    const s = (await findAnalysis(t.services.db, evidenceId))!.summary!
    expect(s.source).toBe('sigmf_archive')
    expect(s.levelUnit).toBe('dBFS')
    expect(s.recording).toMatchObject({ datatype: 'cf32_le', sampleRateHz: FS_HZ, centerFreqHz: CENTER_HZ, sampleCount: SAMPLES, capturesCount: 1, annotationsCount: 1, segmentLength: 4096, segmentCount: 63, window: 'hann' })
    expect(s.recording!.durationS).toBeCloseTo(0.131072, 9)
  })

  it('finds the tone at 434.045 MHz at −20.00 dBFS (±0.1 dB) and the burst at 433.67 MHz at −32.04 dBFS (±0.2 dB) [D]', async () => {
    // tone: A² = 0.01 → −20.00 dBFS; burst: 0.05² = 0.0025 for a quarter of the time → 6.25e-4 → −32.04 dBFS.
    // A trace point reads power in the Hann window's ENBW (1.5 bins, Harris 1978 §IV): a bin-centred tone reads its own power.
    const s = (await findAnalysis(t.services.db, evidenceId))!.summary!
    expect(s.peaks[0]!.freqHz).toBe(CENTER_HZ + TONE_OFFSET_HZ)
    expect(Math.abs(s.peaks[0]!.levelDbm - -20)).toBeLessThan(0.1)
    expect(s.peaks[1]!.freqHz).toBe(CENTER_HZ + BURST_OFFSET_HZ)
    expect(Math.abs(s.peaks[1]!.levelDbm - 10 * Math.log10(0.0025 / 4))).toBeLessThan(0.2)
  })

  it('reads the noise floor, the channel power over the span and the occupied bandwidth [D]', async () => {
    const s = (await findAnalysis(t.services.db, evidenceId))!.summary!
    // noise 1e-4 FS² over 1 MHz in ENBW 1.5 × 1e6/4096 = 366.2 Hz → 3.662e-8 → −74.36 dBFS (median of the bins)
    expect(s.enbwHz).toBeCloseTo(366.2109375, 6)
    expect(Math.abs(s.noiseFloorDbm - 10 * Math.log10((1e-4 * 366.2109375) / 1e6))).toBeLessThan(0.5)
    // total mean power 0.01 + 6.25e-4 + 1e-4 = 0.010725 → −19.70 dBFS
    expect(Math.abs(s.channelPowerDbm! - 10 * Math.log10(0.010725))).toBeLessThan(0.1)
    // 99 % of the power lies between the burst (−250 kHz) and the tone (+125 kHz): 375 kHz within a few bins
    expect(Math.abs(s.occupiedBandwidth!.bandwidthHz - 375e3)).toBeLessThan(2e3)
    expect(s.methods.map((m) => m.id)).toEqual(expect.arrayContaining(['welch-psd', 'trace-peaks-prominence', 'noise-floor-percentile', 'channel-power-enbw', 'occupied-bandwidth-beta2']))
  })

  it('keeps a display trace of at most 4,096 points holding the tone', async () => {
    const d = (await findAnalysis(t.services.db, evidenceId))!.displayTrace!
    expect(d.freqHz.length).toBe(4096)
    expect(d.levelDbm.length).toBe(4096)
    expect(d.sourcePointCount).toBe(4096)
    expect(Math.max(...d.levelDbm)).toBeCloseTo((await findAnalysis(t.services.db, evidenceId))!.summary!.peaks[0]!.levelDbm, 9)
  })

  it('keeps a 256 × 512 spectrogram: the tone in its column in every row, the burst only in the last quarter', async () => {
    const sg = (await findAnalysis(t.services.db, evidenceId))!.spectrogram!
    expect(sg.rowCount).toBe(256)
    expect(sg.columnCount).toBe(512)
    expect(sg.binSpacingHz).toBe(FS_HZ / 512)
    expect(sg.firstColumnHz).toBe(CENTER_HZ - FS_HZ / 2)
    const cells = decodeCells(sg.cellsBase64)
    expect(cells.length).toBe(256 * 512)
    const toneCol = (TONE_OFFSET_HZ - (sg.firstColumnHz - CENTER_HZ)) / sg.binSpacingHz
    const burstCol = (BURST_OFFSET_HZ - (sg.firstColumnHz - CENTER_HZ)) / sg.binSpacingHz
    expect([toneCol, burstCol]).toEqual([320, 128])
    const dbPerStep = (sg.maxDb - sg.minDb) / 255
    const level = (r: number, c: number) => sg.minDb + cells[r * 512 + c]! * dbPerStep
    // one segment per row: single cells scatter (exponentially distributed power), so each row is judged against its median
    const rowMedian = (r: number) => Array.from(cells.subarray(r * 512, (r + 1) * 512)).sort((a, b) => a - b)[256]! * dbPerStep + sg.minDb
    for (let r = 0; r < 256; r++) {
      let best = 0
      for (let c = 1; c < 512; c++) if (cells[r * 512 + c]! > cells[r * 512 + best]!) best = c
      expect(best).toBe(320)
      const noise = rowMedian(r)
      // the burst starts at sample 98 304 = row 192 (512 samples per row)
      if (r >= 192) expect(level(r, 128) - noise).toBeGreaterThan(30)
      else expect(level(r, 128) - noise).toBeLessThan(15)
    }
  })

  it('answers GET /api/evidence/:id/analysis to staff of the office (view schema), 404 to another office, 403 to a complainant', async () => {
    const agent = await signIn(t, staff)
    const res = await agent.get(`/api/evidence/${evidenceId}/analysis`)
    expect(res.status).toBe(200)
    const view = evidenceAnalysisResponseSchema.parse(res.body).analysis
    expectAnswerMatchesDocument('GET', '/api/evidence/:id/analysis', res)
    expect(view.state).toBe('done')
    expect(view.summary!.peaks[0]!.freqHz).toBe(CENTER_HZ + TONE_OFFSET_HZ)
    const other = await signIn(t, await makeUser(t, { role: 'investigator', office: await makeOffice(t) }))
    const far = await other.get(`/api/evidence/${evidenceId}/analysis`)
    expect(far.status).toBe(404)
    expect(far.body.error.code).toBe('evidence_not_found')
    expect((await other.get('/api/evidence/not-a-uuid/analysis')).status).toBe(404)
    const complainant = await signIn(t, await makeUser(t, { role: 'complainant' }))
    expect((await complainant.get(`/api/evidence/${evidenceId}/analysis`)).status).toBe(403)
  })
})

describe('an analyser trace as CSV', () => {
  it('is summarised with its peak, without channel power (no RBW stated) or spectrogram', async () => {
    const lines = ['Frequency (MHz),Level (dBm)']
    for (let i = 0; i < 801; i++) {
      const fMhz = 150 + i * 0.0125
      lines.push(`${fMhz.toFixed(4)},${(i === 400 ? -40 : -95 + ((i * 7919) % 13) / 10).toFixed(1)}`)
    }
    const id = await addEvidence(Buffer.from(lines.join('\n')), 'trace.csv', 'text/csv', 'spectrum_capture')
    await runEvidenceProcessing(deps(), id)
    const a = (await findAnalysis(t.services.db, id))!
    expect(a.state).toBe('done')
    expect(a.summary!.source).toBe('trace_csv')
    expect(a.summary!.peaks[0]).toMatchObject({ freqHz: 155e6, levelDbm: -40 })
    expect(a.summary!.channelPowerDbm).toBeNull()
    expect(a.summary!.warnings.join(' ')).toMatch(/Channel power not computed/)
    expect(a.displayTrace!.freqHz.length).toBe(801)
    expect(a.spectrogram).toBeNull()
  })
})

describe('other layouts', () => {
  it('reads an archive whose data comes before its metadata (a second pass for the data)', async () => {
    const id = await addEvidence(tar([{ name: 'd/d.sigmf-data', body: toneRecording() }, { name: 'd/d.sigmf-meta', body: sigmfMeta() }]), 'd.sigmf', 'application/x-tar', 'iq_recording')
    await runEvidenceProcessing(deps(), id)
    const a = (await findAnalysis(t.services.db, id))!
    expect(a.message).toBeNull()
    expect(a.summary!.peaks[0]!.freqHz).toBe(CENTER_HZ + TONE_OFFSET_HZ)
    expect(Math.abs(a.summary!.peaks[0]!.levelDbm - -20)).toBeLessThan(0.1)
  })

  it('reads a JSON trace with its noise bandwidth, and computes its channel power [D]', async () => {
    // 101 points 10 kHz apart, each −60 dBm in an ENBW of 10 kHz: Σ 101 × 1e-9 W·(Δf/ENBW = 1) → −49.96 dBm
    const freqHz = Array.from({ length: 101 }, (_, i) => 100e6 + i * 1e4)
    const id = await addEvidence(Buffer.from(JSON.stringify({ freqHz, levelDbm: freqHz.map(() => -60), enbwHz: 1e4 })), 't.json', 'application/json', 'spectrum_capture')
    await runEvidenceProcessing(deps(), id)
    const a = (await findAnalysis(t.services.db, id))!
    expect(a.state).toBe('done')
    expect(a.summary!.source).toBe('trace_json')
    expect(a.summary!.channelPowerDbm).toBeCloseTo(-60 + 10 * Math.log10(101), 9)
    expect(a.summary!.peaks).toEqual([])
  })

  it('refuses SigMF metadata uploaded alone, saying what to upload', async () => {
    const id = await addEvidence(sigmfMeta(), 'r.sigmf-meta', 'application/json', 'iq_recording')
    await runEvidenceProcessing(deps(), id)
    expect((await findAnalysis(t.services.db, id))!.message).toMatch(/SigMF metadata without its samples: add its dataset \(the \.sigmf-data file of the same name\) to the case as an I\/Q recording, or upload the recording as a SigMF archive/)
  })
})

describe('malformed files end as recorded failures with their reason', () => {
  const data = toneRecording().subarray(0, 8 * 4096)
  const cases: { name: string; body: () => Buffer; fileName?: string; contentType?: string; message: RegExp }[] = [
    {
      name: 'truncated archive (cut inside the data)',
      body: () => tar([{ name: 'r.sigmf-meta', body: sigmfMeta({}, []) }, { name: 'r.sigmf-data', body: data }]).subarray(0, 512 * 3 + 1000),
      message: /archive ends inside the member "r\.sigmf-data" .* truncated/,
    },
    {
      name: 'data not a whole number of samples',
      body: () => tar([{ name: 'r.sigmf-meta', body: sigmfMeta({}, []) }, { name: 'r.sigmf-data', body: data.subarray(0, data.length - 3) }]),
      message: /not a whole number of cf32_le samples \(8 bytes each\)/,
    },
    {
      name: 'unknown datatype',
      body: () => tar([{ name: 'r.sigmf-meta', body: sigmfMeta({ 'core:datatype': 'cq7_le' }) }, { name: 'r.sigmf-data', body: data }]),
      message: /The SigMF recording cannot be read: global\.core:datatype: 'cq7_le' is not a SigMF dataset format/,
    },
    {
      name: 'metadata that contradicts the data length',
      body: () => tar([{ name: 'r.sigmf-meta', body: sigmfMeta({}) }, { name: 'r.sigmf-data', body: data }]),
      message: /annotations\[0\]: covers samples up to 131072, but the dataset holds only 4096 samples/,
    },
    {
      name: 'path traversal in a member name',
      body: () => tar([{ name: '../../etc/r.sigmf-meta', body: sigmfMeta({}) }, { name: 'r.sigmf-data', body: data }]),
      message: /points outside the archive/,
    },
    {
      name: 'a link member',
      body: () => tar([{ name: 'r.sigmf-meta', body: Buffer.alloc(0), type: '2' }]),
      message: /is a link/,
    },
    {
      name: 'no metadata',
      body: () => tar([{ name: 'r.sigmf-data', body: data }]),
      message: /holds no SigMF metadata file/,
    },
    {
      name: 'not a tar file at all',
      body: () => Buffer.alloc(2048, 7),
      message: /wrong checksum|not an octal number/,
    },
    {
      name: 'a CSV trace with a bad line',
      body: () => Buffer.from('Frequency (MHz),Level (dBm)\n100,-90\n100.1,loud\n100.2,-91\n'),
      fileName: 'bad.csv',
      contentType: 'text/csv',
      message: /The CSV trace cannot be read: line 3/,
    },
    {
      name: 'a file of another kind',
      body: () => Buffer.from('%PDF-1.4'),
      fileName: 'letter.pdf',
      contentType: 'application/pdf',
      message: /not a spectrum trace or an I\/Q recording/,
    },
  ]
  for (const c of cases) {
    it(`${c.name}`, async () => {
      const id = await addEvidence(c.body(), c.fileName ?? 'r.sigmf', c.contentType ?? 'application/x-tar', 'iq_recording')
      await runEvidenceProcessing(deps(), id)
      const a = (await findAnalysis(t.services.db, id))!
      expect(a.state).toBe('failed')
      expect(a.message).toMatch(c.message)
      expect(a.summary).toBeNull()
      const { rows } = await t.pool.query('SELECT processing FROM evidence_files WHERE id = $1', [id])
      expect(rows[0].processing.state).toBe('failed')
      expect(rows[0].processing.message).toBe(a.message)
    })
  }

  it('refuses an oversized data member before reading it', async () => {
    const id = await addEvidence(tar([{ name: 'r.sigmf-meta', body: sigmfMeta({}) }, { name: 'r.sigmf-data', body: data }]), 'r.sigmf', 'application/x-tar', 'iq_recording')
    const { analyseSpectrumFile } = await import('../../server/modules/evidence/processing/analyse-spectrum')
    const { readStoredObject } = await import('../../server/storage/stored-files')
    const { rows } = await t.pool.query('SELECT sf.object_key FROM evidence_files e JOIN stored_files sf ON sf.id = e.stored_file_id WHERE e.id = $1', [id])
    await expect(
      analyseSpectrumFile({ open: () => readStoredObject(store, rows[0].object_key), originalName: 'r.sigmf', contentType: 'application/x-tar', maxDataBytes: 1000 }),
    ).rejects.toThrow(/"r\.sigmf-data" is 32768 bytes, more than the 1000 bytes allowed for it/)
  })
})

describe('through the queue', () => {
  let worker: EvidenceProcessingWorker
  beforeAll(async () => {
    worker = await startEvidenceProcessingWorker({ boss: t.boss, db: t.services.db, objectStore: store }, { pollingIntervalSeconds: 0.5 })
  })
  afterAll(async () => {
    await worker?.stop()
  })

  it('queues a file (state queued), and the worker processes it to done; a bad file fails without stopping the worker', async () => {
    const bad = await addEvidence(Buffer.from('%PDF-1.4'), 'x.pdf', 'application/pdf', 'iq_recording')
    const good = await addEvidence(
      tar([{ name: 'q.sigmf-meta', body: sigmfMeta({}) }, { name: 'q.sigmf-data', body: toneRecording() }]),
      'q.sigmf',
      'application/x-tar',
      'iq_recording',
    )
    await queueEvidenceProcessing(t.services, bad)
    await queueEvidenceProcessing(t.services, good)
    expect((await findAnalysis(t.services.db, good))?.state).toMatch(/queued|running|done/)
    const deadline = Date.now() + 20_000
    while (Date.now() < deadline && (await findAnalysis(t.services.db, good))?.state !== 'done') await new Promise((r) => setTimeout(r, 200))
    expect((await findAnalysis(t.services.db, bad))?.state).toBe('failed')
    const a = await findAnalysis(t.services.db, good)
    expect(a?.state).toBe('done')
    expect(a?.summary?.peaks[0]?.freqHz).toBe(CENTER_HZ + TONE_OFFSET_HZ)
  })
})

describe('a SigMF recording uploaded as its two files (.sigmf-meta + .sigmf-data)', () => {
  let worker: EvidenceProcessingWorker
  let agent: Agent
  beforeAll(async () => {
    worker = await startEvidenceProcessingWorker({ boss: t.boss, db: t.services.db, objectStore: store }, { pollingIntervalSeconds: 0.5 })
    agent = await signIn(t, staff)
  })
  afterAll(async () => {
    await worker?.stop()
  })

  const upload = async (name: string, body: Buffer) => {
    const res = await agent.post(`/api/cases/${worked.id}/evidence`).field('kind', 'iq_recording').attach('file', body, name)
    expect(res.status).toBe(201)
    return res.body.evidence as { id: string; processing: { state: string; message?: string } }
  }
  const processingOf = async (id: string) => (await t.pool.query('SELECT processing FROM evidence_files WHERE id = $1', [id])).rows[0].processing as { state: string; message?: string }
  const settled = async (id: string) => {
    const deadline = Date.now() + 20_000
    while (Date.now() < deadline && !['done', 'failed'].includes((await findAnalysis(t.services.db, id))?.state ?? '')) await new Promise((r) => setTimeout(r, 200))
    return (await findAnalysis(t.services.db, id))!
  }
  /** The same checks as the archive's: the tone at its frequency and level [D]. */
  const expectTone = (a: Awaited<ReturnType<typeof settled>>) => {
    expect(a.message).toBeNull()
    expect(a.state).toBe('done')
    expect(a.summary!.source).toBe('sigmf_files')
    expect(a.summary!.recording).toMatchObject({ datatype: 'cf32_le', sampleRateHz: FS_HZ, centerFreqHz: CENTER_HZ, sampleCount: SAMPLES, annotationsCount: 1 })
    expect(a.summary!.peaks[0]!.freqHz).toBe(CENTER_HZ + TONE_OFFSET_HZ)
    expect(Math.abs(a.summary!.peaks[0]!.levelDbm - -20)).toBeLessThan(0.1)
    expect(a.summary!.peaks[1]!.freqHz).toBe(CENTER_HZ + BURST_OFFSET_HZ)
    expect(a.spectrogram!.rowCount).toBe(256)
  }

  it('metadata first: it waits for its dataset (shown on the list), then the pair is analysed on the dataset', async () => {
    const meta = await upload('pair-a.sigmf-meta', sigmfMeta())
    expect(meta.processing.state).toBe('none')
    expect(meta.processing.message).toMatch(/Waiting for its dataset "pair-a\.sigmf-data"/)
    expect(await findAnalysis(t.services.db, meta.id)).toBeUndefined()
    const list = await agent.get(`/api/cases/${worked.id}/evidence`).expect(200)
    expect(list.body.evidence.find((e: { id: string }) => e.id === meta.id).processing.message).toMatch(/Waiting for its dataset/)

    const data = await upload('pair-a.sigmf-data', toneRecording())
    expectTone(await settled(data.id))
    expect((await processingOf(data.id)).state).toBe('done')
    expect((await processingOf(meta.id)).message).toMatch(/Read together with its dataset "pair-a\.sigmf-data"/)
    expect(await findAnalysis(t.services.db, meta.id)).toBeUndefined()
  })

  it('dataset first: it waits for its metadata, then the pair is analysed', async () => {
    const data = await upload('pair-b.sigmf-data', toneRecording())
    expect(data.processing.state).toBe('none')
    expect(data.processing.message).toMatch(/Waiting for its metadata "pair-b\.sigmf-meta"/)
    await upload('pair-b.sigmf-meta', sigmfMeta())
    expectTone(await settled(data.id))
  })

  it('both in one batch (sent at once): analysed once both are recorded', async () => {
    const [meta, data] = await Promise.all([upload('pair-c.sigmf-meta', sigmfMeta()), upload('pair-c.sigmf-data', toneRecording())])
    expectTone(await settled(data.id))
    expect((await processingOf(meta.id)).message).toMatch(/Read together with/)
  })

  it('does not pair files of another name', async () => {
    const data = await upload('pair-d.sigmf-data', toneRecording())
    await upload('pair-e.sigmf-meta', sigmfMeta())
    expect((await processingOf(data.id)).message).toMatch(/Waiting for its metadata "pair-d\.sigmf-meta"/)
    expect(await findAnalysis(t.services.db, data.id)).toBeUndefined()
  })

  const short = () => toneRecording().subarray(0, 8 * 4096)
  const bad: { name: string; meta: () => Buffer; data: () => Buffer; message: RegExp }[] = [
    { name: 'metadata that contradicts the data length', meta: () => sigmfMeta(), data: short, message: /annotations\[0\]: covers samples up to 131072, but the dataset holds only 4096 samples/ },
    { name: 'an unknown datatype', meta: () => sigmfMeta({ 'core:datatype': 'cq7_le' }), data: short, message: /The SigMF recording cannot be read: global\.core:datatype: 'cq7_le' is not a SigMF dataset format/ },
    { name: 'data not a whole number of samples', meta: () => sigmfMeta({}, []), data: () => short().subarray(0, 8 * 4096 - 3), message: /not a whole number of cf32_le samples \(8 bytes each\)/ },
    { name: 'metadata that is not JSON SigMF', meta: () => Buffer.from('{"global": 3}'), data: short, message: /The SigMF recording cannot be read/ },
  ]
  bad.forEach((c, i) => {
    it(`records a clear failure on the dataset for ${c.name}`, async () => {
      await upload(`bad-${i}.sigmf-meta`, c.meta())
      const data = await upload(`bad-${i}.sigmf-data`, c.data())
      const a = await settled(data.id)
      expect(a.state).toBe('failed')
      expect(a.message).toMatch(c.message)
      expect(a.summary).toBeNull()
      expect((await processingOf(data.id)).message).toBe(a.message)
    })
  })

  it('refuses a dataset processed without its metadata, saying what to add', async () => {
    const id = await addEvidence(short(), 'lone.sigmf-data', 'application/octet-stream', 'iq_recording')
    await runEvidenceProcessing(deps(), id)
    expect((await findAnalysis(t.services.db, id))!.message).toMatch(/no metadata file on the case: Waiting for its metadata "lone\.sigmf-meta"/)
  })
})

describe('the processing sweep (work a crash left undone)', () => {
  let worker: EvidenceProcessingWorker
  beforeAll(async () => {
    worker = await startEvidenceProcessingWorker({ boss: t.boss, db: t.services.db, objectStore: store }, { pollingIntervalSeconds: 0.5 })
  })
  afterAll(async () => {
    await worker?.stop()
  })
  const archive = () => tar([{ name: 's.sigmf-meta', body: sigmfMeta() }, { name: 's.sigmf-data', body: toneRecording() }])
  const later = () => new Date(Date.now() + 11 * 60 * 1000)
  const done = async (id: string) => {
    const deadline = Date.now() + 20_000
    while (Date.now() < deadline && (await findAnalysis(t.services.db, id))?.state !== 'done') await new Promise((r) => setTimeout(r, 200))
    return findAnalysis(t.services.db, id)
  }

  it('queues a file with no analysis row again (its row committed, its job never sent), and it is processed', async () => {
    const id = await addEvidence(archive(), 'crashed.sigmf', 'application/x-tar', 'iq_recording')
    expect(await findAnalysis(t.services.db, id)).toBeUndefined()
    // too young: its upload may still be queuing it
    expect((await requeueStrandedProcessing({ db: t.services.db, boss: t.boss })).analyses).not.toContain(id)
    const swept = await requeueStrandedProcessing({ db: t.services.db, boss: t.boss, now: later() })
    expect(swept.analyses).toContain(id)
    const a = await done(id)
    expect(a?.state).toBe('done')
    expect(a?.summary?.peaks[0]?.freqHz).toBe(CENTER_HZ + TONE_OFFSET_HZ)
  })

  it('queues again an analysis left queued past the job expiry with no live job, but not one whose job is still waiting', async () => {
    const lost = await addEvidence(archive(), 'lost.sigmf', 'application/x-tar', 'iq_recording')
    const waiting = await addEvidence(archive(), 'waiting.sigmf', 'application/x-tar', 'iq_recording')
    const fresh = await addEvidence(archive(), 'fresh.sigmf', 'application/x-tar', 'iq_recording')
    for (const id of [lost, waiting, fresh]) await markAnalysisQueued(t.services.db, id)
    // a live job for `waiting`: sent to start in an hour, so no worker takes it during the test
    await t.boss.send(EVIDENCE_PROCESSING_QUEUE, { evidenceId: waiting }, { startAfter: 3600 })
    await t.pool.query(`UPDATE evidence_analyses SET updated_at = now() - interval '1 hour' WHERE evidence_id = ANY($1)`, [[lost, waiting]])
    const swept = await requeueStrandedProcessing({ db: t.services.db, boss: t.boss, now: later() })
    expect(swept.analyses).toContain(lost)
    expect(swept.analyses).not.toContain(waiting)
    expect(swept.analyses).not.toContain(fresh)
    expect((await done(lost))?.state).toBe('done')
    expect((await findAnalysis(t.services.db, waiting))?.state).toBe('queued')
  })

  it('leaves alone a SigMF half still waiting for its partner, and files already processed', async () => {
    const half = await addEvidence(toneRecording().subarray(0, 4096 * 8), 'alone.sigmf-data', 'application/octet-stream', 'iq_recording')
    const swept = await requeueStrandedProcessing({ db: t.services.db, boss: t.boss, now: later() })
    expect(swept.analyses).not.toContain(half)
    expect((await t.pool.query('SELECT processing FROM evidence_files WHERE id = $1', [half])).rows[0].processing.message).toMatch(/Waiting for its metadata "alone\.sigmf-meta"/)
    // nothing of what is done or failed comes back
    const { rows } = await t.pool.query(`SELECT evidence_id FROM evidence_analyses WHERE state IN ('done', 'failed')`)
    for (const r of rows) expect(swept.analyses).not.toContain(r.evidence_id)
  })
})

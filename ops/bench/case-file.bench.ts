/**
 * Benchmark: drawing and signing a case file (PDF) of a large case — 200 timeline entries,
 * 20 measurements, 10 calculations with their budgets, 20 evidence files with custody logs, an
 * approved finding, a responsible party with 3 notices, a reply and 2 follow-ups — with
 * pdfkit, the committed fonts and a 2048-bit RSA signature (the demo certificate), then its SHA-256: the work GET /api/cases/:id/case-file does after its reads.
 * The database reads are not in it (a handful of indexed queries of one case).
 *
 *   node --import tsx ops/bench/case-file.bench.ts [--iterations 20] [--out ops/bench/results/case-file.md]
 *
 * Target: a signed case file of a case with 200 timeline events ≤ 1 s.
 */
import crypto from 'node:crypto'
import { renderCaseFilePdf, type CaseFileContent } from '../../server/modules/case-file/case-file-pdf.ts'
import { processDemoSigner } from '../../server/modules/case-file/case-file-signing.ts'
import { argValue, loadAverage, machineInfo, machineLine, percentile, reportResult } from './support.ts'

const iterations = Number(argValue('iterations', '20'))
const out = argValue('out', '') || undefined
const TARGET_MS = 1000

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`
const at = (minutes: number) => new Date(Date.UTC(2026, 10, 1, 8, 0) + minutes * 60_000).toISOString()
const methods = [
  { id: 'eirp-back-calculation', source: 'EIRP = P_r + L_b(d); P_r from E or S after ITU-R P.525-4 §3 (A_e = λ²/4π)' },
  { id: 'free-space-p525', source: 'ITU-R P.525-4 (08/2019) §2.2, free-space basic transmission loss 20·log10(4πd/λ)' },
]

function content(): CaseFileContent {
  const timeline = Array.from({ length: 200 }, (_, i) => ({
    id: i + 1,
    at: at(i * 7),
    actor: i % 3 === 0 ? 'Marta Ferreira' : 'Sade Okafor',
    kind: ['note', 'message', 'measurement_recorded', 'calculation_stored', 'evidence_added'][i % 5]!,
    fromState: null,
    toState: null,
    body: `Entry ${i + 1}: portable analyser on pontoon C, broadband hump 150–162 MHz about 20 dB above the usual floor; ≤ −95 dBm at the quay, Ω check of the feeder ${i}.`,
    visibility: (i % 4 === 0 ? 'complainant' : 'internal') as 'internal' | 'complainant',
    data: null,
  }))
  return {
    fileReference: 'QB-26-000001-CF1',
    issuedAt: new Date(),
    issuedBy: 'Sade Okafor',
    timeZone: 'Atlantic/Azores',
    libraryVersion: '2.2.0',
    signer: { subject: 'bench', demo: true, certificateSha256: '0'.repeat(64) },
    detail: {
      id: id(1), reference: 'QB-26-000001', version: 9, status: 'closed', statusLabel: 'Closed', priority: 1, suggestedPriority: 1, service: 'maritime', licenceRef: 'VC-MS-0107',
      freqLowHz: 156.8e6, freqHighHz: 156.8e6, address: 'Harbour office, Quayside Road', latDeg: 48.105, lonDeg: -31.425, sinceDate: '2026-11-01', pattern: 'continuous', patternDetail: null,
      experience: 'degradation', description: 'Channel 16 is buried under a constant hiss.', complainant: { name: 'Port of Harrowmere', email: 'h@example.test', phone: null, organisation: null, hasAccount: true },
      officeId: id(2), officeName: 'Harrowmere', investigatorId: id(3), investigatorName: 'Marta Ferreira', mergedIntoCaseId: null, mergedIntoReference: null,
      resolution: 'source_corrected', resolutionLabel: 'Source found and corrected', closingSummary: 'Amplifier replaced.', receivedAt: at(0), dueAt: at(240), closedAt: at(1500), overdue: false,
      firstResponseDueAt: at(60), firstRespondedAt: at(30), firstResponseOverdue: false,
      abilities: {} as CaseFileContent['detail']['abilities'],
      timeline,
    },
    measurements: Array.from({ length: 20 }, (_, i) => ({
      id: id(100 + i), caseId: id(1), officeId: id(2), author: 'Marta Ferreira', createdAt: at(i), updatedAt: at(i), takenAt: at(i), latDeg: 48.1, lonDeg: -31.4, heightM: 1.5,
      freqHz: 156.8e6, measurementBandwidthHz: 25e3, rbwHz: 10e3, detector: 'rms', reading: { value: -60 - i, unit: 'dBm' }, antenna: { source: 'gain', antennaGainDbi: 2.15 },
      instrumentId: null, cableLossDb: 2, preampGainDb: null, polarisation: 'vertical', bearingDeg: 120, bearingSigmaDeg: 5, notes: null, evidenceFileId: null,
      derived: { fieldStrengthDbuvPerM: 55.1, pfdDbwPerM2: -90.7, isotropicReceivedPowerDbm: -62 }, methods: { fieldStrengthDbuvPerM: methods[0]! }, warnings: ['The antenna gain was typed.'],
      equipment: [], libraryVersion: '2.2.0', version: 1, supersedesId: null, supersededById: null, usedByCalculations: 0, abilities: { edit: false, correct: false },
    })) as CaseFileContent['measurements'],
    calculations: Array.from({ length: 10 }, (_, i) => ({
      id: id(200 + i), caseId: id(1), kind: 'eirp_single_point', kindLabel: 'EIRP from one measured level', inputs: { distanceM: 1000, freqHz: 100e6, model: { kind: 'free-space' } },
      outputs: { value: { eirpDbm: 29.99, erpDbm: 27.85, budget: { rows: [{ name: 'antenna calibration', contribution: 0.75 }] } }, interval: { quantity: 'eirpDbm', low: 28.5, high: 31.5, basis: 'JCGM 100:2008 U = k·u_c, k = 2' } },
      warnings: [], methods, libraryVersion: '2.2.0', author: { id: id(3), name: 'Marta Ferreira' }, at: at(i), references: {}, measurementIds: [], evidenceIds: [],
    })) as CaseFileContent['calculations'],
    evidence: Array.from({ length: 20 }, (_, i) => ({
      evidenceId: id(300 + i), name: `photo-${i}.jpg`, kind: 'photo', sizeBytes: 2_000_000 + i, contentType: 'image/jpeg', sha256: crypto.createHash('sha256').update(String(i)).digest('hex'),
      uploadedBy: { name: 'Marta Ferreira', role: 'staff' }, uploadedAt: at(i),
      custody: Array.from({ length: 5 }, (_, k) => ({ at: at(i + k), actor: 'Marta Ferreira', action: 'downloaded', from: '10.0.0.1', detail: null })),
    })) as CaseFileContent['evidence'],
    findings: { current: null, earlier: [] },
    party: {
      current: { id: id(400), version: 1, name: 'Harbour boat club', address: '2 Quayside Road, Harrowmere', email: null, phone: null, recordedAt: at(900), recordedBy: 'Marta Ferreira' },
      earlier: [],
      notices: Array.from({ length: 3 }, (_, i) => ({
        id: id(410 + i), servedOn: '2026-11-0' + (2 + i), method: 'registered_post' as const, methodLabel: 'Registered post', methodOther: null, servedBy: 'Marta Ferreira',
        reference: `RP-${i}`, summary: 'Replace the masthead amplifier within 7 days.', evidenceId: id(300 + i), recordedAt: at(910 + i), recordedBy: 'Marta Ferreira',
      })),
      replies: [{ id: id(420), receivedOn: '2026-11-06', noticeId: id(410), summary: 'The club ordered a new amplifier.', evidenceId: null, recordedAt: at(950), recordedBy: 'Marta Ferreira' }],
      abilities: { record: false },
    },
    followUps: {
      today: '2026-11-20', timeZone: 'Atlantic/Azores', abilities: { add: false },
      followUps: Array.from({ length: 2 }, (_, i) => ({
        id: id(430 + i), caseId: id(1), dueOn: '2026-11-1' + i, expected: 'Replace the masthead amplifier', source: 'staff' as const, state: 'open' as const, stateLabel: 'Open',
        standing: 'overdue' as const, version: 1, lastNote: null, changedAt: null, createdAt: at(960), abilities: { confirm: false, escalate: false, reopen: false },
      })),
    },
    linkedEvidence: Array.from({ length: 3 }, (_, i) => ({ id: id(300 + i), name: `photo-${i}.jpg`, sha256: crypto.createHash('sha256').update(String(i)).digest('hex'), removed: false })),
  }
}

const signer = processDemoSigner()
const c = content()
const machine = machineInfo()
const samples: number[] = []
let pages = 0
let bytes = 0
for (let i = 0; i < iterations + 2; i++) {
  const t0 = performance.now()
  const { pdf, pageCount } = await renderCaseFilePdf({ ...c, issuedAt: new Date() })
  const signed = await signer.sign(pdf, { reason: 'bench', location: 'bench', contactInfo: 'bench', signingTime: new Date() })
  crypto.createHash('sha256').update(signed).digest('hex')
  const ms = performance.now() - t0
  if (i >= 2) samples.push(ms) // the first two warm the fonts and the JIT
  pages = pageCount
  bytes = signed.length
}
machine.loadEnd = loadAverage()
const p50 = percentile(samples, 50)
const p95 = percentile(samples, 95)
reportResult(
  `# Case file (PDF): draw, sign, hash — 200 timeline entries

${machineLine(machine)}

| case | pages | bytes | runs | median | p95 | max | target | within |
| --- | --- | --- | --- | --- | --- | --- | --- | --- |
| 200 events, 20 measurements, 10 calculations, 20 evidence files, 3 notices, 2 follow-ups | ${pages} | ${bytes} | ${samples.length} | ${p50.toFixed(0)} ms | ${p95.toFixed(0)} ms | ${Math.max(...samples).toFixed(0)} ms | ≤ ${TARGET_MS} ms | ${p95 <= TARGET_MS ? 'yes' : 'NO'} |

The database reads of the request (a case, its timeline, measurements, calculations, findings and
evidence rows) are not in these times.
`,
  out,
)

/**
 * The case file's pages, drawn with pdfkit from what the case file service gathered: summary,
 * the report, the timeline, measurements and calculations (each with its methods, their
 * sources and the library version), the evidence manifest with SHA-256, the finding and its
 * approval, the cautions, and a closing page on how to check this copy. Every page carries the
 * file's own reference and "page n of N". The enforcement record (the responsible party, notices
 * served with date and method, replies, follow-ups and who moved them) is printed in full, for
 * enforcement rests on proof of notice. Text is set in the Liberation fonts committed under
 * server/assets/fonts (OFL), which hold ≤ ≥ Ω µ − × →.
 *
 * The PDF is written without object streams (pdfkit never makes them), so the signature's
 * placeholder can be added to the finished file as an incremental update.
 */
import { fileURLToPath } from 'node:url'
import PDFDocument from 'pdfkit'
import { CAUTION_LINES, ENFORCEMENT_CAUTION } from '../../../shared/domain/cautions'
import { CASE_STATE_LABELS, type CaseState } from '../../../shared/domain/case-lifecycle'
import { DETECTOR_LABELS } from '../../../shared/domain/equipment'
import { CUSTODY_ACTION_LABELS, EVIDENCE_KIND_LABELS } from '../../../shared/domain/evidence'
import { ENFORCEMENT_EVENT_TITLES, type FollowUpSource } from '../../../shared/domain/follow-ups'
import { EXPERIENCE_LABELS, harmClassText, SERVICE_LABELS } from '../../../shared/domain/services'
import { eventTitle } from '../../../shared/domain/timeline-titles'
import type { FindingsResponse } from '../../../shared/schemas/findings'
import type { CaseFollowUpsResponse, NoticeView, ResponsiblePartyResponse, ResponsiblePartyView } from '../../../shared/schemas/follow-ups'
import type { MeasurementView } from '../../../shared/schemas/measurements'
import type { CalculationView, CaseDetail } from '../../../shared/schemas/views'
import type { ManifestEntry } from '../evidence-bundle/bundle-manifest'

const FONT_DIR = fileURLToPath(new URL('../../assets/fonts/', import.meta.url))
const FONTS = {
  regular: `${FONT_DIR}LiberationSans-Regular.ttf`,
  bold: `${FONT_DIR}LiberationSans-Bold.ttf`,
  italic: `${FONT_DIR}LiberationSans-Italic.ttf`,
  mono: `${FONT_DIR}LiberationMono-Regular.ttf`,
}

export interface CaseFileContent {
  /** The file's own reference (printed in every footer). */
  fileReference: string
  issuedAt: Date
  issuedBy: string
  /** The office's IANA time zone: times read in it (UTC beside the approval). */
  timeZone: string
  detail: CaseDetail
  measurements: MeasurementView[]
  calculations: CalculationView[]
  findings: FindingsResponse
  evidence: ManifestEntry[]
  /** The responsible party (every version), the notices served on it and its replies. */
  party: ResponsiblePartyResponse
  /** The case's follow-ups (their moves are read from the timeline). */
  followUps: CaseFollowUpsResponse
  /** The evidence files a notice or reply points at, removed ones included. */
  linkedEvidence: LinkedEvidence[]
  /** The radio library's version when the file was made (each record keeps its own). */
  libraryVersion: string
  signer: { subject: string; demo: boolean; certificateSha256: string }
}

/** An evidence file a notice or reply points at. */
export interface LinkedEvidence {
  id: string
  name: string
  sha256: string
  removed: boolean
}

const FOLLOW_UP_SOURCE_WORDS: Record<FollowUpSource, string> = { finding: 'The approved finding\u2019s compliance deadline', staff: 'Added by staff' }
const INK = '#18212b'
const MUTED = '#4a5562'
const RULE = '#c9ced6'
const CAUTION = '#8a4b00'

/** "2026-12-05 06:12:30" in the zone. */
function localTime(iso: string | Date, timeZone: string): string {
  const d = typeof iso === 'string' ? new Date(iso) : iso
  return new Intl.DateTimeFormat('sv-SE', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23' }).format(d)
}

/** A number for reading: up to 7 significant figures, no float noise. */
function num(v: number): string {
  if (!Number.isFinite(v)) return String(v)
  if (Number.isInteger(v) && Math.abs(v) < 1e15) return String(v)
  return String(Number(v.toPrecision(7)))
}

function freqText(hz: number): string {
  if (hz >= 1e9) return `${num(hz / 1e9)} GHz`
  if (hz >= 1e6) return `${num(hz / 1e6)} MHz`
  if (hz >= 1e3) return `${num(hz / 1e3)} kHz`
  return `${num(hz)} Hz`
}

/** A stored value as "key: value" lines (nested objects joined with dots; keys carry their units). */
function flatten(v: unknown, prefix = ''): string[] {
  if (v === null || v === undefined) return prefix ? [`${prefix}: —`] : []
  if (typeof v === 'number') return [`${prefix || 'value'}: ${num(v)}`]
  if (typeof v === 'string' || typeof v === 'boolean') return [`${prefix || 'value'}: ${String(v)}`]
  if (Array.isArray(v)) {
    if (v.every((x) => typeof x === 'number' || typeof x === 'string')) return [`${prefix || 'values'}: ${v.map((x) => (typeof x === 'number' ? num(x) : x)).join(', ')}`]
    return v.flatMap((x, i) => flatten(x, `${prefix}[${i + 1}]`))
  }
  return Object.entries(v as Record<string, unknown>).flatMap(([k, x]) => flatten(x, prefix ? `${prefix}.${k}` : k))
}

class Writer {
  readonly doc: PDFKit.PDFDocument
  private readonly left: number
  private readonly width: number
  constructor(doc: PDFKit.PDFDocument) {
    this.doc = doc
    this.left = doc.page.margins.left
    this.width = doc.page.width - doc.page.margins.left - doc.page.margins.right
  }
  /** Starts a new page when less than `pt` is left on this one. */
  room(pt: number) {
    if (this.doc.y + pt > this.doc.page.height - this.doc.page.margins.bottom) this.doc.addPage()
  }
  heading(text: string) {
    // a heading keeps a few lines of its section with it
    this.room(110)
    this.doc.moveDown(0.8).font('bold').fontSize(14).fillColor(INK).text(text, this.left, this.doc.y, { width: this.width })
    const y = this.doc.y + 2
    this.doc.moveTo(this.left, y).lineTo(this.left + this.width, y).lineWidth(0.6).strokeColor(RULE).stroke()
    this.doc.moveDown(0.5)
  }
  subheading(text: string) {
    this.room(40)
    this.doc.moveDown(0.4).font('bold').fontSize(10.5).fillColor(INK).text(text, this.left, this.doc.y, { width: this.width })
    this.doc.moveDown(0.15)
  }
  para(text: string, o: { font?: 'regular' | 'italic' | 'mono' | 'bold'; size?: number; color?: string; indent?: number } = {}) {
    this.doc
      .font(o.font ?? 'regular')
      .fontSize(o.size ?? 9.5)
      .fillColor(o.color ?? INK)
      .text(text, this.left + (o.indent ?? 0), this.doc.y, { width: this.width - (o.indent ?? 0), lineGap: 1.5 })
  }
  /** Label and value side by side (the value wraps in its column). */
  field(label: string, value: string, o: { mono?: boolean } = {}) {
    const labelWidth = 130
    const valueOptions = { width: this.width - labelWidth, lineGap: 1.5 }
    this.doc.font(o.mono ? 'mono' : 'regular').fontSize(o.mono ? 8.5 : 9.5)
    // a value that fits on a page starts on the page it ends on; a longer one flows on
    this.room(Math.min(this.doc.heightOfString(value || '—', valueOptions), 240) + 2)
    const page = this.doc.page
    const y = this.doc.y
    this.doc.font('bold').fontSize(9).fillColor(MUTED).text(label, this.left, y, { width: labelWidth - 8 })
    const afterLabel = this.doc.y
    this.doc
      .font(o.mono ? 'mono' : 'regular')
      .fontSize(o.mono ? 8.5 : 9.5)
      .fillColor(INK)
      .text(value || '—', this.left + labelWidth, y, valueOptions)
    this.doc.y = (this.doc.page === page ? Math.max(this.doc.y, afterLabel) : this.doc.y) + 2
    this.doc.x = this.left
  }
  lines(items: string[], o: { mono?: boolean; indent?: number } = {}) {
    for (const l of items) this.para(l, { font: o.mono ? 'mono' : 'regular', size: o.mono ? 8.5 : 9.5, indent: o.indent ?? 10 })
  }
  rule() {
    const y = this.doc.y + 3
    this.doc.moveTo(this.left, y).lineTo(this.left + this.width, y).lineWidth(0.3).strokeColor(RULE).stroke()
    this.doc.moveDown(0.5)
  }
  box(title: string, lines: string[], color: string) {
    this.room(30 + lines.length * 24)
    const top = this.doc.y
    this.doc.font('bold').fontSize(10).fillColor(color).text(title, this.left + 10, top + 6, { width: this.width - 20 })
    for (const l of lines) this.doc.font('regular').fontSize(9.5).fillColor(INK).text(l, this.left + 10, this.doc.y + 2, { width: this.width - 20, lineGap: 1.5 })
    const bottom = this.doc.y + 6
    this.doc.rect(this.left, top, 3, bottom - top).fill(color)
    this.doc.y = bottom + 4
    this.doc.x = this.left
  }
}

/** A party's contact as recorded: every field, "—" for none given. */
function contactText(p: ResponsiblePartyView): string {
  return [`address: ${p.address ?? '—'}`, `e-mail: ${p.email ?? '—'}`, `phone: ${p.phone ?? '—'}`].join('\n')
}

/** How a notice was served, in words ("Other" carries its description). */
const methodText = (n: NoticeView) => (n.method === 'other' ? `Other: ${n.methodOther ?? '—'}` : n.methodLabel)

/** Oldest first: the order a reader follows the notices and replies in. */
const byDayThenRecorded = <T extends { recordedAt: string }>(day: (x: T) => string) => (a: T, b: T) => day(a).localeCompare(day(b)) || a.recordedAt.localeCompare(b.recordedAt)

/** Section 8: the responsible party (current record and every earlier version), each notice and each reply. */
function drawParty(w: Writer, c: CaseFileContent) {
  const tz = c.timeZone
  const { current, earlier, notices, replies } = c.party
  w.heading('8. Responsible party and notices')
  if (!current && notices.length === 0 && replies.length === 0) {
    w.para('No responsible party, notice or reply has been recorded.', { font: 'italic' })
    return
  }
  w.para(`The party responsible for the source as recorded, every notice served on it and every reply, as kept on the case; times in ${tz}.`, { font: 'italic', size: 8.5, color: MUTED })
  w.doc.moveDown(0.3)
  if (!current) w.para('No responsible party has been recorded.', { font: 'italic' })
  else {
    w.field('Name', current.name)
    w.field('Contact', contactText(current))
    w.field(current.version === 1 ? 'Recorded' : `Changed (version ${current.version})`, `${localTime(current.recordedAt, tz)} by ${current.recordedBy}`)
    for (const e of earlier) w.field(`Earlier: version ${e.version}`, `${e.name} — recorded ${localTime(e.recordedAt, tz)} by ${e.recordedBy}\n${contactText(e)}`)
  }
  const evidenceText = (id: string | null): string | null => {
    if (!id) return null
    const f = c.linkedEvidence.find((x) => x.id === id)
    if (!f) return `evidence file ${id} (not found on the case)`
    const inManifest = c.evidence.findIndex((e) => e.evidenceId === id)
    return `${f.name}, SHA-256 ${f.sha256.slice(0, 16)}…${inManifest >= 0 ? ` (E${inManifest + 1} in the manifest)` : f.removed ? ' (since removed from the case)' : ''}`
  }
  const sortedNotices = [...notices].sort(byDayThenRecorded((n) => n.servedOn))
  w.room(120) // a list's title stays with its first entry
  w.subheading('Notices served')
  if (sortedNotices.length === 0) w.para('No notice has been served.', { font: 'italic' })
  sortedNotices.forEach((n, i) => {
    w.room(100)
    w.subheading(`N${i + 1}. Served on ${n.servedOn} — ${methodText(n)}`)
    w.field('Served on', n.servedOn)
    w.field('Method', methodText(n))
    w.field('Served by', n.servedBy)
    w.field('Reference', n.reference ?? '—')
    w.field('What it says', n.summary)
    w.field('Evidence', evidenceText(n.evidenceId) ?? 'none linked')
    w.field('Recorded', `${localTime(n.recordedAt, tz)} by ${n.recordedBy}`)
    w.rule()
  })
  w.room(100)
  w.subheading('Replies')
  const sortedReplies = [...replies].sort(byDayThenRecorded((r) => r.receivedOn))
  if (sortedReplies.length === 0) w.para('No reply has been received.', { font: 'italic' })
  sortedReplies.forEach((r, i) => {
    const answers = r.noticeId ? sortedNotices.findIndex((n) => n.id === r.noticeId) : -1
    w.room(70)
    w.subheading(`R${i + 1}. Received on ${r.receivedOn}${answers >= 0 ? ` — to notice N${answers + 1}` : ''}`)
    w.field('Received on', r.receivedOn)
    w.field('Summary', r.summary)
    const ev = evidenceText(r.evidenceId)
    if (ev) w.field('Evidence', ev)
    w.field('Recorded', `${localTime(r.recordedAt, tz)} by ${r.recordedBy}`)
    w.rule()
  })
}

/** Section 9: each follow-up with its deadline, what is expected, its state and every move on it (who, when) from the timeline. */
function drawFollowUps(w: Writer, c: CaseFileContent) {
  const tz = c.timeZone
  const { followUps, today } = c.followUps
  w.heading('9. Follow-ups')
  if (followUps.length === 0) {
    w.para('No follow-up has been set.', { font: 'italic' })
    return
  }
  w.para(`Deadlines are days of the office’s calendar (${tz}); standing as of ${today}. Who added, confirmed, escalated or reopened each comes from the timeline.`, { font: 'italic', size: 8.5, color: MUTED })
  w.doc.moveDown(0.3)
  followUps.forEach((f, i) => {
    const standing = f.standing === 'overdue' ? ' — overdue' : f.standing === 'due' ? ' — due today' : ''
    w.room(100)
    w.subheading(`F${i + 1}. Due on ${f.dueOn} — ${f.stateLabel}${standing}`)
    w.field('Due on', f.dueOn)
    w.field('Expected', f.expected)
    w.field('State', `${f.stateLabel}${standing}`)
    w.field('From', FOLLOW_UP_SOURCE_WORDS[f.source])
    const moves = c.detail.timeline.filter((e) => e.data?.followUpId === f.id && e.kind in ENFORCEMENT_EVENT_TITLES)
    w.field('History', moves.map((e) => `${localTime(e.at, tz)}  ${ENFORCEMENT_EVENT_TITLES[e.kind]} — ${e.actor}${e.body ? `: ${e.body}` : ''}`).join('\n') || `added ${localTime(f.createdAt, tz)}`)
    w.rule()
  })
}

/** Draws the case file; resolves to the unsigned PDF and its page count. */
export async function renderCaseFilePdf(c: CaseFileContent): Promise<{ pdf: Buffer; pageCount: number }> {
  const d = c.detail
  const tz = c.timeZone
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: 56, bottom: 64, left: 56, right: 56 },
    bufferPages: true,
    autoFirstPage: true,
    pdfVersion: '1.7',
    lang: 'en',
    displayTitle: true,
    info: {
      Title: `Case file ${c.fileReference} — case ${d.reference}`,
      Author: d.officeName,
      Subject: `Case file of interference case ${d.reference}`,
      Creator: 'Quietband',
      Producer: 'Quietband (pdfkit)',
      CreationDate: c.issuedAt,
    },
  })
  doc.registerFont('regular', FONTS.regular)
  doc.registerFont('bold', FONTS.bold)
  doc.registerFont('italic', FONTS.italic)
  doc.registerFont('mono', FONTS.mono)
  const chunks: Buffer[] = []
  doc.on('data', (b: Buffer) => chunks.push(b))
  const ended = new Promise<void>((resolve, reject) => {
    doc.on('end', () => resolve())
    doc.on('error', reject)
  })
  const w = new Writer(doc)

  // Title block
  doc.font('bold').fontSize(20).fillColor(INK).text(`Case file — ${d.reference}`)
  doc.moveDown(0.2)
  w.para(`${d.officeName} · file ${c.fileReference} · issued ${localTime(c.issuedAt, tz)} (${tz}) by ${c.issuedBy}`, { color: MUTED })
  if (c.signer.demo) {
    doc.moveDown(0.4)
    w.box('DEMO SIGNATURE — NOT FOR LEGAL USE', [`This file is signed with a generated demonstration certificate (${c.signer.subject}), not an office's certificate.`], CAUTION)
  }

  // 1. Summary
  w.heading('1. Summary')
  w.field('Case', d.reference, { mono: true })
  w.field('State', d.statusLabel)
  w.field('Harm class', harmClassText(d.priority))
  w.field('Affected service', SERVICE_LABELS[d.service])
  w.field('Frequencies', d.freqLowHz === d.freqHighHz ? freqText(d.freqLowHz) : `${freqText(d.freqLowHz)} – ${freqText(d.freqHighHz)}`)
  w.field('Office', d.officeName)
  w.field('Investigator', d.investigatorName ?? 'not assigned')
  w.field('Received', `${localTime(d.receivedAt, tz)} (${tz})`)
  w.field('Due', `${localTime(d.dueAt, tz)}${d.overdue ? ' — overdue' : ''}`)
  if (d.closedAt) w.field('Closed', localTime(d.closedAt, tz))
  if (d.resolutionLabel) w.field('Resolution', d.resolutionLabel)
  if (d.closingSummary) w.field('Closing summary', d.closingSummary)
  if (d.mergedIntoReference) w.field('Merged into', d.mergedIntoReference)
  w.field('Contents', `${d.timeline.length} timeline entries, ${c.measurements.length} measurement(s), ${c.calculations.length} calculation(s), ${c.evidence.length} evidence file(s), ${c.findings.current ? 1 + c.findings.earlier.length : 0} finding proposal(s), ${c.party.notices.length} notice(s), ${c.party.replies.length} repl${c.party.replies.length === 1 ? 'y' : 'ies'}, ${c.followUps.followUps.length} follow-up(s)`)

  // 2. The report
  w.heading('2. The report')
  w.field('Reported by', [d.complainant.name, d.complainant.organisation].filter(Boolean).join(', '))
  w.para('The complainant’s contact details are kept in the case record and are left out of this file.', { font: 'italic', size: 8.5, color: MUTED, indent: 130 })
  w.field('Location', `${d.address} (${num(d.latDeg)}°, ${num(d.lonDeg)}°)`)
  if (d.licenceRef) w.field('Licence', d.licenceRef)
  w.field('Since', d.sinceDate)
  w.field('Occurs', `${d.pattern.replace(/_/g, ' ')}${d.patternDetail ? ` — ${d.patternDetail}` : ''}`)
  w.field('Experience', EXPERIENCE_LABELS[d.experience])
  w.field('Description', d.description)

  // 3. Timeline
  w.heading('3. Timeline')
  w.para(`Every entry of the case’s append-only timeline up to this file, oldest first; times in ${tz}.`, { font: 'italic', size: 8.5, color: MUTED })
  doc.moveDown(0.3)
  for (const e of d.timeline) {
    w.room(30)
    const states = e.fromState && e.toState && e.fromState !== e.toState ? `  [${CASE_STATE_LABELS[e.fromState as CaseState] ?? e.fromState} → ${CASE_STATE_LABELS[e.toState as CaseState] ?? e.toState}]` : ''
    const y = doc.y
    doc.font('mono').fontSize(8).fillColor(MUTED).text(localTime(e.at, tz), 56, y, { width: 100 })
    doc.font('bold').fontSize(9.5).fillColor(INK).text(`${eventTitle(e)}${states}`, 160, y, { width: doc.page.width - 216 })
    doc.font('regular').fontSize(8.5).fillColor(MUTED).text(`${e.actor}${e.visibility === 'complainant' ? ' · shown to the complainant' : ''}`, 160, doc.y, { width: doc.page.width - 216 })
    if (e.body) doc.font('regular').fontSize(9).fillColor(INK).text(e.body, 160, doc.y + 1, { width: doc.page.width - 216, lineGap: 1.2 })
    if (e.data && typeof e.data.sha256 === 'string' && !e.body?.includes(e.data.sha256)) doc.font('mono').fontSize(7.5).fillColor(INK).text(`SHA-256 ${e.data.sha256}`, 160, doc.y + 1, { width: doc.page.width - 216 })
    doc.x = 56
    doc.moveDown(0.45)
  }

  // 4. Measurements
  w.heading('4. Measurements')
  if (c.measurements.length === 0) w.para('No measurements were recorded.', { font: 'italic' })
  c.measurements.forEach((m, i) => {
    w.subheading(`M${i + 1}. ${freqText(m.freqHz)}, ${num(m.reading.value)} ${m.reading.unit}${m.supersededById ? ' (corrected by a later record)' : ''}`)
    w.field('Taken', `${localTime(m.takenAt, tz)} by ${m.author}, at ${num(m.latDeg)}°, ${num(m.lonDeg)}°${m.heightM !== null ? `, ${num(m.heightM)} m above ground` : ''}`)
    const setup = [
      m.measurementBandwidthHz !== null ? `measurement bandwidth ${freqText(m.measurementBandwidthHz)}` : null,
      m.rbwHz !== null ? `RBW ${freqText(m.rbwHz)}` : null,
      m.detector ? `detector ${DETECTOR_LABELS[m.detector]}` : null,
      m.cableLossDb !== null ? `cable loss ${num(m.cableLossDb)} dB` : null,
      m.preampGainDb !== null ? `preamplifier gain ${num(m.preampGainDb)} dB` : null,
      m.antenna.source === 'gain' ? `antenna gain ${num(m.antenna.antennaGainDbi)} dBi` : m.antenna.source === 'factor' ? `antenna factor ${num(m.antenna.antennaFactorDbPerM)} dB/m` : m.antenna.source === 'register' ? 'antenna from the equipment register' : 'no antenna correction',
      m.polarisation ? `polarisation ${m.polarisation}` : null,
      m.bearingDeg !== null ? `bearing ${num(m.bearingDeg)}°${m.bearingSigmaDeg !== null ? ` ± ${num(m.bearingSigmaDeg)}°` : ''}` : null,
    ].filter(Boolean)
    w.field('Set-up', setup.join('; '))
    if (m.equipment.length > 0) w.field('Equipment', m.equipment.map((q) => flatten(q).join(', ')).join(' | '))
    const derived = flatten(m.derived)
    if (derived.length > 0) w.field('Derived levels', derived.join('\n'), { mono: true })
    w.field('Methods', Object.entries(m.methods).map(([k, r]) => `${k}: ${r.id} — ${r.source}`).join('\n') || 'none')
    w.field('Library version', m.libraryVersion, { mono: true })
    if (m.warnings.length > 0) w.field('Warnings', m.warnings.join('\n'))
    if (m.notes) w.field('Notes', m.notes)
    w.rule()
  })

  // 5. Calculations
  w.heading('5. Calculations')
  if (c.calculations.length === 0) w.para('No calculations were stored.', { font: 'italic' })
  c.calculations.forEach((k, i) => {
    w.subheading(`C${i + 1}. ${k.kindLabel}`)
    w.field('Stored', `${localTime(k.at, tz)} by ${k.author.name}`)
    w.field('Inputs', flatten(k.inputs).join('\n'), { mono: true })
    w.field('Result', flatten(k.outputs.value).join('\n'), { mono: true })
    if (k.outputs.interval) w.field('Interval', `${k.outputs.interval.quantity}: ${num(k.outputs.interval.low)} … ${num(k.outputs.interval.high)} (${k.outputs.interval.basis})`)
    w.field('Methods', k.methods.map((r) => `${r.id} — ${r.source}`).join('\n') || 'none')
    w.field('Library version', k.libraryVersion, { mono: true })
    if (k.warnings.length > 0) w.field('Warnings', k.warnings.join('\n'))
    if (Object.keys(k.references).length > 0) w.field('References', flatten(k.references).join('\n'), { mono: true })
    w.rule()
  })

  // 6. Evidence manifest
  w.heading('6. Evidence manifest')
  w.para(
    'The files on the case with the SHA-256 taken when each was received (the same entries as the evidence bundle’s manifest, which also re-hashes every file as it is bundled). Removed files are left out.',
    { font: 'italic', size: 8.5, color: MUTED },
  )
  doc.moveDown(0.3)
  if (c.evidence.length === 0) w.para('No evidence files are on the case.', { font: 'italic' })
  c.evidence.forEach((f, i) => {
    w.subheading(`E${i + 1}. ${f.name}`)
    w.field('Kind', `${EVIDENCE_KIND_LABELS[f.kind]} (${f.contentType}, ${f.sizeBytes} bytes)`)
    w.field('SHA-256', f.sha256, { mono: true })
    w.field('Received', `${localTime(f.uploadedAt, tz)} from ${f.uploadedBy.name}${f.uploadedBy.role === 'complainant' ? ' (complainant)' : ''}`)
    w.field('Custody', f.custody.map((e) => `${localTime(e.at, tz)}  ${CUSTODY_ACTION_LABELS[e.action]} — ${e.actor}${e.detail ? ` (${e.detail})` : ''}`).join('\n') || '—')
    w.rule()
  })

  // 7. Finding and approval
  w.heading('7. Finding and approval')
  const f = c.findings.current
  if (!f) w.para('No finding has been proposed.', { font: 'italic' })
  else {
    w.field('Proposed', `${localTime(f.at, tz)} by ${f.author.name}`)
    w.field('Source', f.sourceDescription)
    if (f.sourcePosition) w.field('Source position', `${num(f.sourcePosition.latDeg)}°, ${num(f.sourcePosition.lonDeg)}°`)
    if (f.operator) w.field('Operator', f.operator)
    w.field('Recommended action', f.recommendedActionLabel)
    if (f.complianceDeadline) w.field('Compliance deadline', f.complianceDeadline)
    w.field('Summary', f.summary)
    w.field('Rests on', f.calculations.map((k) => `C${c.calculations.findIndex((x) => x.id === k.id) + 1} ${k.kindLabel}`).join('\n') || 'no stored calculation')
    doc.moveDown(0.3)
    if (f.review?.outcome === 'approved') {
      w.box(
        `Approved by ${f.review.by}`,
        [`on ${localTime(f.review.at, tz)} (${tz}); ${f.review.at} UTC`, ...(f.review.comments ? [`Closing summary: ${f.review.comments}`] : [])],
        '#1e6a3a',
      )
    } else if (f.review?.outcome === 'returned') {
      w.box(`Sent back by ${f.review.by}`, [`on ${localTime(f.review.at, tz)} (${tz})`, ...(f.review.comments ? [f.review.comments] : [])], CAUTION)
    } else {
      w.box('Not yet approved', ['The finding waits for a supervisor’s review.'], CAUTION)
    }
    if (c.findings.earlier.length > 0) {
      w.subheading('Earlier proposals')
      for (const e of c.findings.earlier) w.para(`${localTime(e.at, tz)} by ${e.author.name}: ${e.recommendedActionLabel}${e.review ? ` — ${e.review.outcome === 'returned' ? 'sent back' : 'approved'} by ${e.review.by} on ${localTime(e.review.at, tz)}` : ''}`, { indent: 10 })
    }
  }

  // 8. and 9. The enforcement record: proof of notice and the deadlines that follow it
  drawParty(w, c)
  drawFollowUps(w, c)

  // 10. Cautions
  w.heading('10. Cautions')
  w.box('Before acting on this file', [ENFORCEMENT_CAUTION, ...CAUTION_LINES], CAUTION)

  // 11. About this file
  w.heading('11. About this file')
  w.field('File reference', c.fileReference, { mono: true })
  w.field('Issued', `${localTime(c.issuedAt, tz)} (${tz}); ${c.issuedAt.toISOString()} UTC, by ${c.issuedBy}`)
  w.field('Signed by', `${c.signer.subject}${c.signer.demo ? ' — a DEMO certificate, not valid for legal use' : ''}`)
  w.field('Certificate SHA-256', c.signer.certificateSha256, { mono: true })
  w.field('Radio library', `${c.libraryVersion} now; each record above names the version it was computed with`)
  w.field('How to check a copy', `The file carries a PAdES signature over all its bytes. When it was issued its SHA-256 was written to the case’s append-only timeline (entry “Case file ${c.fileReference} issued”): a copy whose SHA-256 equals that entry is this file, unchanged.`)
  w.field('Fonts', 'Liberation Sans and Liberation Mono 2.1.5 (SIL Open Font License 1.1)')

  // Footers: the file's reference and page n of N on every page
  const range = doc.bufferedPageRange()
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i)
    const bottom = doc.page.margins.bottom
    doc.page.margins.bottom = 0
    const y = doc.page.height - 40
    doc.moveTo(56, y - 6).lineTo(doc.page.width - 56, y - 6).lineWidth(0.4).strokeColor(RULE).stroke()
    doc.font('regular').fontSize(8).fillColor(MUTED).text(`Case file ${c.fileReference} · case ${d.reference} · ${d.officeName}${c.signer.demo ? ' · DEMO signature' : ''}`, 56, y, { width: doc.page.width - 112 - 90, lineBreak: false })
    doc.text(`Page ${i - range.start + 1} of ${range.count}`, doc.page.width - 56 - 90, y, { width: 90, align: 'right', lineBreak: false })
    doc.page.margins.bottom = bottom
  }
  doc.end()
  await ended
  return { pdf: Buffer.concat(chunks), pageCount: range.count }
}

/**
 * Demo cases for the invented Vellmark Coast region: eleven complaints told through the real
 * services (submitReport, triageCase, assignCase, …), so every timeline, tracking link and
 * queued e-mail is the one the product itself would write. One closed Harrowmere case keeps an
 * enforcement record: its finding's compliance deadline became a follow-up that has passed
 * unconfirmed (overdue on the dashboard and the investigator's queue), a notice served by
 * registered post, the owner's reply, and a second follow-up confirmed. The services run on the story's
 * clock (ServiceContext.now), so received, due and closed times and every timeline entry
 * agree with the story; nothing is rewritten afterwards. Nothing here is a real place,
 * person, licensee or station. Called by seedDemo right after the offices and staff exist.
 */
import type pg from 'pg'
import PgBoss from 'pg-boss'
import type { Resolution } from '../shared/domain/case-lifecycle'
import type { Priority } from '../shared/domain/services'
import type { RecommendedAction } from '../shared/domain/findings'
import type { NoticeMethod } from '../shared/domain/follow-ups'
import { followUpInputSchema, followUpMoveInputSchema, noticeInputSchema, replyInputSchema, responsiblePartyInputSchema } from '../shared/schemas/follow-ups'
import { reportSchema, type ReportInput } from '../shared/schemas/cases'
import type { SessionUser } from '../shared/schemas/auth'
import type { ServiceContext } from '../server/context'
import { createDb } from '../server/db/client'
import { DEFAULT_MAIL_QUEUE_OPTIONS, MAIL_QUEUE } from '../server/jobs/boss'
import type { Actor } from '../server/policy/policy'
import { submitReport } from '../server/modules/cases/reports.service'
import { assignCase, closeCase, dismissReport, proposeFinding, returnFinding, startFieldWork, triageCase } from '../server/modules/cases/case-moves.service'
import { addCaseNote } from '../server/modules/cases/case-notes.service'
import { addFollowUp, moveFollowUp } from '../server/modules/follow-ups/follow-ups.service'
import { recordNotice, recordReply, recordResponsibleParty } from '../server/modules/responsible-parties/responsible-parties.service'
import { DEMO_REGION_BOX } from './demo-data/region'

/** The demo region's bounding box (every demo and generated location lies inside it). */
export const DEMO_REGION = DEMO_REGION_BOX

type Step =
  | { move: 'triage'; priority: Priority; note?: string }
  | { move: 'assign'; investigator: string }
  | { move: 'startFieldWork' }
  | { move: 'proposeFinding'; reason: string; source: string; action: RecommendedAction; operator?: string; complianceDays?: number }
  | { move: 'returnFinding'; reason: string }
  | { move: 'close'; resolution: Resolution; reason: string }
  | { move: 'dismiss'; resolution: 'no_interference_found' | 'referred'; reason: string }
  | { move: 'note'; by: 'supervisor' | 'investigator'; visibility: 'internal' | 'complainant'; body: string; requestsInformation?: boolean }

/**
 * The enforcement record kept after a closing, each entry so many hours after it: the party
 * responsible for the source, a notice served on it, its reply, a follow-up added by staff and
 * confirmed. Written by the responsible-party and follow-up services, as staff would.
 */
type EnforcementStep = { hoursAfterClosing: number; by: 'supervisor' | 'investigator' } & (
  | { record: 'party'; name: string; address?: string; email?: string; phone?: string }
  | { record: 'notice'; method: NoticeMethod; reference?: string; summary: string }
  | { record: 'reply'; summary: string }
  | { record: 'followUp'; dueInDays: number; expected: string }
  | { record: 'confirmFollowUp'; note: string }
)

export interface DemoCase {
  /** The office the location must route to (checked while seeding). */
  office: 'Harrowmere' | 'Kestrel Bay'
  /** The report as filed; `since` follows from receivedHoursAgo and startedDaysBefore. */
  report: Omit<ReportInput, 'since'>
  /** E-mail of the demo complainant account that files it, when filed signed in. */
  signedInAs?: string
  /** When the story says it arrived, and how many days before that it began. */
  receivedHoursAgo: number
  startedDaysBefore: number
  /** When a closed story says it was closed. */
  closedHoursAgo?: number
  steps: Step[]
  /** Kept after the closing (a closed story only). */
  enforcement?: EnforcementStep[]
}

export const DEMO_CASES: readonly DemoCase[] = [
  {
    office: 'Harrowmere',
    signedInAs: 'harbour.master@example.test',
    receivedHoursAgo: 1.5,
    startedDaysBefore: 0,
    report: {
      name: 'Port of Harrowmere (harbour master)',
      email: 'harbour.master@example.test',
      phone: '+00 41 555 0100',
      organisation: 'Port of Harrowmere',
      service: 'maritime',
      licenceRef: 'VC-MS-0107',
      frequencyFrom: 156.8,
      frequencyUnit: 'MHz',
      address: 'Harbour office, Quayside Road, Harrowmere',
      latDeg: 48.105,
      lonDeg: -31.425,
      pattern: 'continuous',
      experience: 'degradation',
      description:
        'Channel 16 at the coast station is buried under a constant hiss since this morning. Vessels calling the harbour are hard to copy and we cannot rule out a missed distress call. The noise is strongest near pontoon C.',
    },
    steps: [
      { move: 'triage', priority: 1, note: 'Distress and calling channel: safety of life. Field work today.' },
      { move: 'assign', investigator: 'm.ferreira@quietband.test' },
      { move: 'startFieldWork' },
      {
        move: 'note',
        by: 'investigator',
        visibility: 'internal',
        body: 'Portable analyser on pontoon C: broadband hump 150–162 MHz, about 20 dB above the usual floor, peaking at berth C14. Suspect a self-oscillating TV masthead amplifier on a moored yacht.',
      },
    ],
  },
  {
    office: 'Kestrel Bay',
    receivedHoursAgo: 9,
    startedDaysBefore: 3,
    report: {
      name: 'Dariusz Fenwick',
      email: 'noc@tidewire-mobile.example.test',
      organisation: 'Tidewire Mobile (network operations)',
      service: 'mobile_network',
      licenceRef: 'VC-MN-0003',
      frequencyFrom: 1710,
      frequencyTo: 1785,
      frequencyUnit: 'MHz',
      address: 'Cell site KB-117, Gullridge Farm, Kestrel Bay',
      latDeg: 47.58,
      lonDeg: -30.42,
      pattern: 'continuous',
      experience: 'degradation',
      description:
        'Uplink noise on all three sectors of site KB-117 has risen by about 12 dB. Dropped calls and failed hand-overs across the sector facing the Gullridge estate. The pattern suggests an unlicensed mobile booster.',
    },
    steps: [
      { move: 'triage', priority: 2, note: 'Whole cell affected, many subscribers: raised from 3 to 2.' },
      { move: 'assign', investigator: 'j.mbeki@quietband.test' },
    ],
  },
  {
    office: 'Harrowmere',
    receivedHoursAgo: 20,
    startedDaysBefore: 2,
    report: {
      name: 'Noor Achterberg',
      email: 'links@saltmarsh-broadband.example.test',
      phone: '+00 41 555 0142',
      organisation: 'Saltmarsh Broadband Co-operative',
      service: 'fixed_link',
      licenceRef: 'VC-FX-0042',
      frequencyFrom: 5.79,
      frequencyTo: 5.83,
      frequencyUnit: 'GHz',
      address: 'Link end B, water tower, Saltmarsh Point',
      latDeg: 48.31,
      lonDeg: -31.62,
      pattern: 'continuous',
      experience: 'outage',
      description:
        'Our 5.8 GHz point-to-point link from the water tower to the village mast has been down for two days. Receive level is normal but the link reports a noise floor 25 dB too high, so it cannot hold the lowest modulation.',
    },
    steps: [
      { move: 'triage', priority: 2 },
      { move: 'assign', investigator: 't.nakamura@quietband.test' },
      { move: 'startFieldWork' },
      {
        move: 'proposeFinding',
        source: 'Outdoor wireless bridge at the grain store, 600 m from link end B',
        operator: 'Owner of the grain store',
        action: 'advise_operator',
        reason:
          'Source found: an outdoor wireless bridge at the grain store, 600 m from link end B, set to the link’s channel at full power. The owner has agreed to move it to another channel by Friday. Proposed resolution: source corrected.',
      },
    ],
  },
  {
    office: 'Kestrel Bay',
    receivedHoursAgo: 30,
    startedDaysBefore: 5,
    report: {
      name: 'Maren Quist',
      email: 'studio@kestrelbay-community-radio.example.test',
      organisation: 'Kestrel Bay Community Radio',
      service: 'broadcasting',
      licenceRef: 'VC-BC-0215',
      frequencyFrom: 101.7,
      frequencyUnit: 'MHz',
      address: 'Listeners in Lower Town and along Harbour Parade, Kestrel Bay',
      latDeg: 47.7,
      lonDeg: -30.68,
      pattern: 'certain_hours',
      patternDetail: 'Evenings, roughly 19:00 to midnight',
      experience: 'degradation',
      description:
        'Every evening another station with dance music and no identification takes over our 101.7 MHz frequency in Lower Town. Listeners phone us to ask why we changed format. We believe it is an unlicensed transmitter.',
    },
    steps: [
      { move: 'triage', priority: 3, note: 'Likely unlicensed broadcasting. Needs an evening direction-finding run.' },
      {
        move: 'note',
        by: 'supervisor',
        visibility: 'complainant',
        requestsInformation: true,
        body: 'Could you send us the times of the most recent evenings the other station was on air, and any recording you have?',
      },
    ],
  },
  {
    office: 'Harrowmere',
    receivedHoursAgo: 0.4,
    startedDaysBefore: 0,
    report: {
      name: 'Yusuf Penhallow',
      email: 'ops@harrowmere-fields.example.test',
      organisation: 'Harrowmere Fields Airfield',
      service: 'radionavigation',
      licenceRef: 'VC-AN-0009',
      frequencyFrom: 114.35,
      frequencyUnit: 'MHz',
      address: 'Navigation beacon HRW, Harrowmere Fields Airfield',
      latDeg: 48.21,
      lonDeg: -31.22,
      pattern: 'intermittent',
      experience: 'degradation',
      description:
        'The monitor receiver of our navigation beacon HRW raised alarms three times this afternoon. A steady carrier appears a few kilohertz from the beacon frequency for a few minutes and then goes away.',
    },
    steps: [],
  },
  {
    office: 'Kestrel Bay',
    receivedHoursAgo: 288,
    startedDaysBefore: 30,
    closedHoursAgo: 70,
    report: {
      name: 'Callum Reyes-Ibsen',
      email: 'callum.reyes@example.test',
      service: 'licence_exempt',
      frequencyFrom: 2.4,
      frequencyTo: 2.4835,
      frequencyUnit: 'GHz',
      address: '7 Heron Close, Kestrel Bay',
      latDeg: 47.55,
      lonDeg: -30.51,
      pattern: 'intermittent',
      experience: 'nuisance',
      description: 'Our home Wi-Fi slows down every evening and video calls freeze. I think a neighbour has something that blocks it.',
    },
    steps: [
      { move: 'triage', priority: 4 },
      { move: 'assign', investigator: 'a.kowalczyk@quietband.test' },
      { move: 'startFieldWork' },
      {
        move: 'proposeFinding',
        source: 'Neighbouring Wi-Fi networks sharing the 2.4 GHz band',
        action: 'no_action',
        reason:
          'Measured in the evening: 14 neighbouring Wi-Fi networks share the 2.4 GHz band, all within their rules; no other emission found. This is congestion, not harmful interference. Advised moving the router to the 5 GHz band.',
      },
      {
        move: 'close',
        resolution: 'no_interference_found',
        reason:
          'We measured at your home and found no interfering transmitter. The slowdown comes from many Wi-Fi networks sharing the same band in the evening. Switching your router to its 5 GHz band should help.',
      },
    ],
  },
  {
    office: 'Harrowmere',
    receivedHoursAgo: 144,
    startedDaysBefore: 20,
    report: {
      name: 'Petra Halvorsen-Moyo',
      email: 'vc3orw@example.test',
      service: 'amateur',
      licenceRef: 'VC3ORW',
      frequencyFrom: 7000,
      frequencyTo: 7200,
      frequencyUnit: 'kHz',
      address: 'Ropewalk Cottages, Harrowmere',
      latDeg: 48.02,
      lonDeg: -31.55,
      pattern: 'certain_hours',
      patternDetail: 'Daylight hours, worst around midday',
      experience: 'degradation',
      description:
        'Since a few weeks the 40 m band is covered by a buzzing noise with peaks every 50 kHz during the day. It stops at dusk. Weak stations I used to work are now impossible to hear.',
    },
    steps: [
      { move: 'triage', priority: 3 },
      { move: 'assign', investigator: 't.nakamura@quietband.test' },
      { move: 'startFieldWork' },
      {
        move: 'proposeFinding',
        source: 'Solar inverter at 12 Ropewalk (likely)',
        action: 'advise_operator',
        reason: 'Daylight-only comb of emissions at 50 kHz spacing; the solar inverter at 12 Ropewalk is the likely source.',
      },
      {
        move: 'returnFinding',
        reason: 'Please confirm with a measurement while the owner switches the inverter off and on, and record the field strength at the complainant’s antenna.',
      },
    ],
  },
  {
    office: 'Kestrel Bay',
    receivedHoursAgo: 480,
    startedDaysBefore: 1,
    closedHoursAgo: 120,
    report: {
      name: 'Ilse Corrigan',
      email: 'control-room@kestrelbay-fire.example.test',
      organisation: 'Kestrel Bay Fire and Rescue',
      service: 'ppdr',
      licenceRef: 'VC-PP-0031',
      frequencyFrom: 380,
      frequencyTo: 385,
      frequencyUnit: 'MHz',
      address: 'Repeater site, Crannock Head',
      latDeg: 47.45,
      lonDeg: -30.3,
      pattern: 'certain_hours',
      patternDetail: 'Weekdays 07:00 to 18:00',
      experience: 'outage',
      description:
        'Crews near the Crannock Head industrial estate lose contact with the control room on weekdays. The repeater shows a strong signal on its receive band during working hours only.',
    },
    steps: [
      { move: 'triage', priority: 1, note: 'Emergency services radio: safety of life.' },
      { move: 'assign', investigator: 'a.kowalczyk@quietband.test' },
      { move: 'startFieldWork' },
      {
        move: 'proposeFinding',
        source: 'Mains-powered signal blocker in unit 4 of the Crannock Head estate',
        action: 'formal_warning',
        reason:
          'A mains-powered signal blocker in unit 4 of the Crannock Head estate, used to stop staff using phones, jams 380–960 MHz. Device seized with the owner’s consent; formal warning and penalty notice issued.',
      },
      {
        move: 'close',
        resolution: 'enforcement_action',
        reason: 'We found a radio jamming device at a nearby business. It has been taken out of use and the operator faces enforcement action. Your repeater should now work normally.',
      },
    ],
  },
  {
    office: 'Kestrel Bay',
    receivedHoursAgo: 96,
    startedDaysBefore: 4,
    closedHoursAgo: 72,
    report: {
      name: 'Edda Lindgren-Obi',
      email: 'edda.lo@example.test',
      service: 'broadcasting',
      frequencyFrom: 474,
      frequencyTo: 482,
      frequencyUnit: 'MHz',
      address: '22 Marram Lane, Tollbridge',
      latDeg: 47.78,
      lonDeg: -30.9,
      pattern: 'continuous',
      experience: 'degradation',
      description: 'Since last week half of my television channels are missing or break up into blocks. The others still work.',
    },
    steps: [
      {
        move: 'dismiss',
        resolution: 'referred',
        reason:
          'The channels you are missing moved last week when the Vellmark Hill transmitter was re-planned. This is not interference: a retune of your television will bring them back. We have passed your report to the network operator’s viewer help line.',
      },
    ],
  },
  {
    office: 'Harrowmere',
    signedInAs: 'rosa.lindqvist@example.test',
    receivedHoursAgo: 3,
    startedDaysBefore: 7,
    report: {
      name: 'Rosa Lindqvist',
      email: 'rosa.lindqvist@example.test',
      service: 'licence_exempt',
      frequencyFrom: 433.92,
      frequencyUnit: 'MHz',
      address: '3 Chandlers Row, Harrowmere',
      latDeg: 48.14,
      lonDeg: -31.37,
      pattern: 'intermittent',
      experience: 'outage',
      description: 'My garage door remote and the remotes of two neighbours stopped working at the same time last week. They work again some evenings.',
    },
    steps: [],
  },
  {
    office: 'Harrowmere',
    receivedHoursAgo: 336,
    startedDaysBefore: 10,
    closedHoursAgo: 240,
    report: {
      name: 'Tamsin Oyelaran-Reid',
      email: 'tamsin.or@example.test',
      service: 'broadcasting',
      frequencyFrom: 88,
      frequencyTo: 108,
      frequencyUnit: 'MHz',
      address: '9 Lanthorn Street, Harrowmere',
      latDeg: 48.09,
      lonDeg: -31.41,
      pattern: 'certain_hours',
      patternDetail: 'Every day from dawn to dusk',
      experience: 'degradation',
      description:
        'Since the spring FM radio in our street is drowned in a rough buzz during the day. At night it is clear. Three neighbours on Lanthorn Street hear the same on their kitchen radios.',
    },
    steps: [
      { move: 'triage', priority: 3 },
      { move: 'assign', investigator: 'm.ferreira@quietband.test' },
      { move: 'startFieldWork' },
      {
        move: 'proposeFinding',
        source: 'Battery charger of the rooftop solar system at 11 Lanthorn Street',
        operator: 'Owner of 11 Lanthorn Street',
        action: 'formal_warning',
        complianceDays: 7,
        reason:
          'Walked the street with a portable receiver: the buzz peaks under the roof of 11 Lanthorn Street and stops when its solar battery charger is switched off. The charger carries no conformity marking. The owner must replace it with a compliant unit within 7 days.',
      },
      {
        move: 'close',
        resolution: 'enforcement_action',
        reason: 'We found the source: a battery charger at a house in your street. Its owner has been formally told to replace it within 7 days, and we follow that up.',
      },
    ],
    enforcement: [
      { hoursAfterClosing: 2, by: 'investigator', record: 'party', name: 'Owen Pascoe-Marr (owner, 11 Lanthorn Street)', address: '11 Lanthorn Street, Harrowmere', phone: '+00 41 555 0187' },
      {
        hoursAfterClosing: 3,
        by: 'investigator',
        record: 'notice',
        method: 'registered_post',
        reference: 'RP 5520 1187 HM',
        summary: 'Formal warning: replace the solar battery charger with a compliant unit within 7 days of the finding; keep it switched off until then.',
      },
      { hoursAfterClosing: 70, by: 'investigator', record: 'reply', summary: 'Letter from the owner: a replacement charger is on order; the old one stays switched off at night only.' },
      { hoursAfterClosing: 72, by: 'investigator', record: 'followUp', dueInDays: 2, expected: 'Send the order confirmation of the replacement charger' },
      { hoursAfterClosing: 100, by: 'investigator', record: 'confirmFollowUp', note: 'Order confirmation received by e-mail and filed.' },
    ],
  },
]

/**
 * A job queue on the seeding pool, without maintenance timers: the seeder only queues
 * e-mails (the app's worker sends them to the development mailbox later).
 */
async function seedingBoss(pool: pg.Pool): Promise<PgBoss> {
  const boss = new PgBoss({ db: { executeSql: (text: string, values?: unknown[]) => pool.query(text, values) }, schema: 'pgboss', supervise: false, schedule: false })
  boss.on('error', (err) => console.error('job queue error while seeding:', err))
  await boss.start()
  await boss.createQueue(MAIL_QUEUE)
  return boss
}

interface Staff {
  actor: Actor
  session: SessionUser
}

async function loadStaff(pool: pg.Pool): Promise<Map<string, Staff>> {
  const { rows } = await pool.query(
    `SELECT u.id, u.email, u.name, u.role, u.office_id, o.name AS office_name FROM users u LEFT JOIN offices o ON o.id = u.office_id`,
  )
  return new Map(
    rows.map((r) => [
      r.email as string,
      {
        actor: { id: r.id, role: r.role, officeId: r.office_id },
        session: { id: r.id, email: r.email, name: r.name, role: r.role, officeId: r.office_id, officeName: r.office_name },
      },
    ]),
  )
}

/** The day (YYYY-MM-DD, UTC) of an instant. */
const dayOf = (at: Date) => at.toISOString().slice(0, 10)

/**
 * Writes a closed story's enforcement record through the services, each entry at its hour
 * after the closing (the inputs are parsed with the API's own schemas).
 */
async function seedEnforcement(
  ctx: ServiceContext,
  caseId: string,
  steps: readonly EnforcementStep[],
  o: { closedAt: Date; supervisor: Actor; investigator: Actor; setClock: (at: Date) => void },
): Promise<void> {
  let lastFollowUp: { id: string; version: number } | undefined
  for (const step of steps) {
    const at = new Date(o.closedAt.getTime() + step.hoursAfterClosing * 3600_000)
    o.setClock(at)
    const actor = step.by === 'supervisor' ? o.supervisor : o.investigator
    switch (step.record) {
      case 'party':
        await recordResponsibleParty(ctx, actor, caseId, responsiblePartyInputSchema.parse({ name: step.name, address: step.address, email: step.email, phone: step.phone }))
        break
      case 'notice':
        await recordNotice(ctx, actor, caseId, noticeInputSchema.parse({ servedOn: dayOf(at), method: step.method, reference: step.reference, summary: step.summary }))
        break
      case 'reply':
        await recordReply(ctx, actor, caseId, replyInputSchema.parse({ receivedOn: dayOf(at), summary: step.summary }))
        break
      case 'followUp': {
        const f = await addFollowUp(ctx, actor, caseId, followUpInputSchema.parse({ dueOn: dayOf(new Date(at.getTime() + step.dueInDays * 86_400_000)), expected: step.expected }))
        lastFollowUp = { id: f.id, version: f.version }
        break
      }
      case 'confirmFollowUp':
        if (!lastFollowUp) throw new Error('demo enforcement: confirm a follow-up added before')
        await moveFollowUp(ctx, actor, lastFollowUp.id, 'confirm', followUpMoveInputSchema.parse({ version: lastFollowUp.version, note: step.note }))
        break
    }
  }
}

/** Files the demo cases and takes each through its story. Returns their references. */
export async function seedDemoCases(pool: pg.Pool, opts: { publicUrl?: string; now?: Date } = {}): Promise<string[]> {
  const now = opts.now ?? new Date()
  const boss = await seedingBoss(pool)
  let storyClock = now
  const ctx: ServiceContext = {
    pool,
    db: createDb(pool),
    boss,
    publicUrl: (opts.publicUrl ?? process.env.PUBLIC_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, ''),
    mailQueue: DEFAULT_MAIL_QUEUE_OPTIONS,
    now: () => storyClock,
  }
  try {
    const staff = await loadStaff(pool)
    const person = (email: string) => {
      const s = staff.get(email)
      if (!s) throw new Error(`demo user ${email} is missing`)
      return s
    }
    const references: string[] = []
    for (const story of DEMO_CASES) {
      const receivedAt = new Date(now.getTime() - story.receivedHoursAgo * 3600_000)
      const since = new Date(receivedAt.getTime() - story.startedDaysBefore * 86_400_000).toISOString().slice(0, 10)
      const report = reportSchema.parse({ ...story.report, since })
      // the steps happen evenly between arrival and closing (or shortly before now)
      const endAt = story.closedHoursAgo !== undefined ? now.getTime() - story.closedHoursAgo * 3600_000 : now.getTime() - 5 * 60_000
      const stepMs = Math.max(60_000, (endAt - receivedAt.getTime()) / Math.max(1, story.steps.length))
      storyClock = receivedAt
      const filed = await submitReport(ctx, report, story.signedInAs ? person(story.signedInAs).session : undefined)
      if (filed.officeName !== story.office) throw new Error(`demo case at ${story.report.address} routed to ${filed.officeName}, expected ${story.office}`)
      const { rows } = await pool.query(`SELECT u.email FROM users u JOIN offices o ON o.id = u.office_id WHERE o.name = $1 AND u.role = 'supervisor' ORDER BY u.email LIMIT 1`, [story.office])
      const supervisor = person(rows[0].email).actor
      let investigator: Actor | undefined
      let version = 1
      for (const [i, step] of story.steps.entries()) {
        storyClock = new Date(Math.min(receivedAt.getTime() + (i + 1) * stepMs, now.getTime()))
        const id = filed.caseId
        switch (step.move) {
          case 'triage':
            version = (await triageCase(ctx, supervisor, id, { version, priority: step.priority, note: step.note })).version
            break
          case 'assign':
            investigator = person(step.investigator).actor
            version = (await assignCase(ctx, supervisor, id, { version, investigatorId: investigator.id })).version
            break
          case 'startFieldWork':
            version = (await startFieldWork(ctx, investigator!, id, { version })).version
            break
          case 'proposeFinding':
            version = (
              await proposeFinding(ctx, investigator!, id, {
                version,
                summary: step.reason,
                sourceDescription: step.source,
                operator: step.operator,
                recommendedAction: step.action,
                // a day of the story's clock (the seeder writes history, so the day may have passed since)
                complianceDeadline: step.complianceDays !== undefined ? new Date(storyClock.getTime() + step.complianceDays * 86_400_000).toISOString().slice(0, 10) : undefined,
                calculationIds: [],
                evidenceIds: [],
              })
            ).version
            break
          case 'returnFinding':
            version = (await returnFinding(ctx, supervisor, id, { version, reason: step.reason })).version
            break
          case 'close':
            version = (await closeCase(ctx, supervisor, id, { version, resolution: step.resolution, reason: step.reason })).version
            break
          case 'dismiss':
            version = (await dismissReport(ctx, supervisor, id, { version, resolution: step.resolution, reason: step.reason })).version
            break
          case 'note':
            await addCaseNote(ctx, step.by === 'supervisor' ? supervisor : investigator!, id, {
              body: step.body,
              visibility: step.visibility,
              requestsInformation: step.requestsInformation,
            })
            break
        }
      }
      if (story.enforcement) {
        if (story.closedHoursAgo === undefined) throw new Error(`demo case at ${story.report.address}: enforcement records follow a closing`)
        await seedEnforcement(ctx, filed.caseId, story.enforcement, {
          closedAt: new Date(endAt),
          supervisor,
          investigator: investigator ?? supervisor,
          setClock: (at) => {
            storyClock = at
          },
        })
      }
      references.push(filed.reference)
    }
    return references
  } finally {
    await boss.stop({ graceful: false, close: false, wait: true, timeout: 2000 })
  }
}

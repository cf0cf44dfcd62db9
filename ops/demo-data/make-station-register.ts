/**
 * Writes the invented Vellmark Coast licence register, `station-register.csv`, beside this file:
 * a few hundred stations on the mainland (FM broadcast, PMR, coast stations, point-to-point
 * links, cellular base stations, amateur repeaters) with invented licensees, and the scenario's
 * PMR base at the Harrowmere marina. Deterministic (a seeded generator): running it again
 * writes the same file.
 *
 *   node --import tsx ops/demo-data/make-station-register.ts
 */
import fs from 'node:fs'
import { DEMO_REGISTER_FILE, DEMO_REGISTER_HEADERS, DEMO_SCENARIO_STATION } from './station-register'

/** mulberry32: a small seeded generator, enough for invented data. */
function generator(seed: number) {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}
const rnd = generator(20261205)
const between = (lo: number, hi: number) => lo + (hi - lo) * rnd()
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!
const round = (v: number, digits: number) => Number(v.toFixed(digits))

/** The mainland's coast (its west edge) by latitude; stations stand east of it. */
const COAST: [number, number][] = [
  [47.2, -30.46],
  [47.4, -30.66],
  [47.57, -30.86],
  [47.71, -30.92],
  [47.86, -31.18],
  [48.04, -31.52],
  [48.12, -31.62],
  [48.3, -31.66],
  [48.45, -31.78],
  [48.6, -31.8],
]
function coastLon(lat: number): number {
  for (let i = 1; i < COAST.length; i++) {
    const [la0, lo0] = COAST[i - 1]!
    const [la1, lo1] = COAST[i]!
    if (lat <= la1) return lo0 + ((lat - la0) / (la1 - la0)) * (lo1 - lo0)
  }
  return COAST[COAST.length - 1]![1]
}
function onLand(): [number, number] {
  const lat = between(47.25, 48.55)
  return [round(lat, 4), round(between(coastLon(lat) + 0.06, -29.86), 4)]
}

const PLACES = ['Harrowmere', 'Kestrel Bay', 'Corran Point', 'Wyndle', 'Ostby', 'Lantry', 'Vellmark', 'Marrow', 'Fellgate', 'Saltry', 'Brannock', 'Dunhollow']
const TRADES = ['Haulage', 'Taxis', 'Farms', 'Quarries', 'Security', 'Water Board', 'Ferries', 'Builders', 'Fisheries', 'Rescue Trust', 'Utilities', 'Logistics']
const FORMS = ['Ltd', 'Co-operative', 'plc', '& Sons', 'Group']
const licensee = () => `${pick(PLACES)} ${pick(TRADES)} ${pick(FORMS)}`

interface Row {
  code: string
  licensee: string
  service: string
  lat: number
  lon: number
  heightM: number
  centreMhz: number
  bandwidthKhz: number
  eirpDbw?: number
  erpW?: number
  txDbm?: number
  gainDbi?: number
  feederDb?: number
  validFrom: string
  validUntil: string
}

const rows: Row[] = []
const used = new Set<string>()
function code(prefix: string): string {
  for (;;) {
    const c = `VM-${prefix}-${String(Math.floor(between(1000, 9999)))}`
    if (!used.has(c)) {
      used.add(c)
      return c
    }
  }
}
function validity(): { validFrom: string; validUntil: string } {
  const from = 2019 + Math.floor(between(0, 7))
  const month = String(1 + Math.floor(between(0, 12))).padStart(2, '0')
  return { validFrom: `${from}-${month}-01`, validUntil: `${from + pick([5, 10])}-${month}-01` }
}
function add(n: number, make: () => Omit<Row, 'code' | 'lat' | 'lon' | 'validFrom' | 'validUntil'> & { prefix: string }) {
  for (let i = 0; i < n; i++) {
    const { prefix, ...r } = make()
    const [lat, lon] = onLand()
    rows.push({ code: code(prefix), lat, lon, ...validity(), ...r })
  }
}

// FM broadcast: 87.5–108 MHz on the 100 kHz raster, 200 kHz, ERP 1–20 kW
const BROADCASTERS = ['Vellmark Community Radio', 'Coastline FM Trust', 'Sound of Wyndle Ltd', 'Harbour Hits Broadcasting', 'Fellgate Classic Radio', 'Lantry Valley Radio']
add(24, () => ({ prefix: 'FM', licensee: pick(BROADCASTERS), service: 'FM broadcast', heightM: round(between(30, 120), 0), centreMhz: round(87.6 + 0.1 * Math.floor(between(0, 204)), 1), bandwidthKhz: 200, erpW: pick([1000, 2000, 5000, 10000, 20000]) }))
// PMR: VHF 146–174 MHz and UHF 440–470 MHz, 12.5 kHz channels, EIRP in dBW (the scenario's 445.9–446.3 MHz left clear)
function pmrChannel(): number {
  for (;;) {
    const f = rnd() < 0.5 ? 146 + 0.0125 * Math.floor(between(0, 2240)) : 440 + 0.0125 * Math.floor(between(0, 2400))
    if (f < 445.9 || f > 446.3) return round(f, 4)
  }
}
add(130, () => ({ prefix: 'PMR', licensee: licensee(), service: 'PMR', heightM: round(between(8, 40), 0), centreMhz: pmrChannel(), bandwidthKhz: 12.5, eirpDbw: round(between(0, 17), 1) }))
// coast stations: maritime VHF 156–162 MHz, 25 kHz, ERP in watts
add(10, () => ({ prefix: 'CST', licensee: pick(['Vellmark Coastguard Agency', 'Port of Harrowmere', 'Kestrel Bay Harbour Authority']), service: 'Maritime coast station', heightM: round(between(15, 60), 0), centreMhz: round(156.025 + 0.025 * Math.floor(between(0, 240)), 3), bandwidthKhz: 25, erpW: pick([25, 50, 100]) }))
// point-to-point links: conducted power with the antenna's gain and the feeder loss
const LINK_BANDS: [number, number, number[]][] = [
  [6000, 7100, [29650, 59300]],
  [7125, 8500, [14000, 28000]],
  [10700, 11700, [28000, 56000]],
  [12750, 13250, [14000, 28000]],
  [17700, 19700, [27500, 55000]],
  [22000, 23600, [28000, 56000]],
]
add(80, () => {
  const [lo, hi, bws] = pick(LINK_BANDS)
  return {
    prefix: 'PTP',
    licensee: pick(['Vellmark Telecom plc', 'Northshore Backhaul Ltd', 'Ostby Wireless Co-operative', 'Corran Grid Utilities', 'Saltry Water Board']),
    service: 'Fixed point-to-point link',
    heightM: round(between(15, 50), 0),
    centreMhz: round(between(lo + 60, hi - 60), 1),
    bandwidthKhz: pick(bws),
    txDbm: round(between(18, 30), 0),
    gainDbi: round(between(30, 42), 1),
    feederDb: round(between(0.5, 2.5), 1),
  }
})
// cellular base stations: downlink blocks, EIRP in dBW
const CELL_BANDS: [number, number, number][] = [
  [791, 821, 10000],
  [925, 960, 5000],
  [1805, 1880, 20000],
  [2110, 2170, 15000],
]
add(60, () => {
  const [lo, hi, bw] = pick(CELL_BANDS)
  return { prefix: 'BTS', licensee: pick(['Tidewave Mobile Ltd', 'Gullnet Communications plc', 'Vellmark Telecom plc']), service: 'Cellular base station', heightM: round(between(18, 45), 0), centreMhz: round(between(lo + bw / 2000, hi - bw / 2000), 1), bandwidthKhz: bw, eirpDbw: round(between(25, 33), 1) }
})
// amateur repeaters: 145.6–145.8 MHz and 430–440 MHz, 12.5 kHz, ERP in watts
add(18, () => ({ prefix: 'RPT', licensee: pick(['Vellmark Amateur Radio Society', 'Wyndle & District Radio Club', 'Kestrel Bay Repeater Group']), service: 'Amateur repeater', heightM: round(between(10, 35), 0), centreMhz: rnd() < 0.5 ? round(145.6 + 0.0125 * Math.floor(between(0, 16)), 4) : round(430 + 0.0125 * Math.floor(between(0, 800)), 4), bandwidthKhz: 12.5, erpW: pick([5, 10, 25, 50]) }))

// the scenario's station: 0 dBW EIRP = 30 dBm on 446.1 MHz ± 100 kHz
const s = DEMO_SCENARIO_STATION
used.add(s.stationCode)
rows.splice(57, 0, {
  code: s.stationCode,
  licensee: s.licensee,
  service: s.service,
  lat: s.latitudeDeg,
  lon: s.longitudeDeg,
  heightM: s.antennaHeightM,
  centreMhz: 446.1,
  bandwidthKhz: 200,
  eirpDbw: 0,
  validFrom: '2024-04-01',
  validUntil: '2034-04-01',
})

const cell = (v: string | number | undefined) => {
  const t = v === undefined ? '' : String(v)
  return /[",\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t
}
const lines = [
  DEMO_REGISTER_HEADERS.join(','),
  ...rows.map((r) => [r.code, r.licensee, r.service, r.lat, r.lon, r.heightM, r.centreMhz, r.bandwidthKhz, r.eirpDbw, r.erpW, r.txDbm, r.gainDbi, r.feederDb, r.validFrom, r.validUntil].map(cell).join(',')),
]
fs.writeFileSync(DEMO_REGISTER_FILE, `${lines.join('\n')}\n`)
console.log(`wrote ${rows.length} stations to ${DEMO_REGISTER_FILE}`)

/**
 * What the synthetic cases are made of: invented places, streets, names, organisations and
 * licence codes of the Vellmark Coast region, the bands each service is reported in, and the
 * words of descriptions and findings. Data only; the drawing is in make-case.ts.
 */
import type { CaseState, Resolution } from '../../shared/domain/case-lifecycle'
import type { AffectedService, Experience, OccurrencePattern } from '../../shared/domain/services'

/** Invented places of the Vellmark Coast, each with an approximate centre. */
export const PLACES = [
  { name: 'Harrowmere', latDeg: 48.12, lonDeg: -31.4 },
  { name: 'Kestrel Bay', latDeg: 47.62, lonDeg: -30.55 },
  { name: 'Saltmarsh Point', latDeg: 48.31, lonDeg: -31.62 },
  { name: 'Tollbridge', latDeg: 47.78, lonDeg: -30.9 },
  { name: 'Crannock Head', latDeg: 47.45, lonDeg: -30.3 },
  { name: 'Gullridge', latDeg: 47.58, lonDeg: -30.42 },
  { name: 'Fennick Sands', latDeg: 48.45, lonDeg: -31.95 },
  { name: 'Orrin’s Ford', latDeg: 47.95, lonDeg: -31.1 },
  { name: 'Wethercote', latDeg: 48.25, lonDeg: -30.8 },
  { name: 'Brackwater', latDeg: 47.32, lonDeg: -30.05 },
  { name: 'Skerrow Isle', latDeg: 48.52, lonDeg: -30.3 },
  { name: 'Merrow End', latDeg: 47.4, lonDeg: -31.3 },
  { name: 'Ashgill', latDeg: 48.02, lonDeg: -31.85 },
  { name: 'Caddon Quay', latDeg: 47.7, lonDeg: -30.2 },
  { name: 'Starling Down', latDeg: 47.88, lonDeg: -30.45 },
  { name: 'Pellow Reach', latDeg: 48.4, lonDeg: -31.25 },
] as const

export const STREETS = ['Quayside Road', 'Chandlers Row', 'Marram Lane', 'Heron Close', 'Netmakers Way', 'Lantern Street', 'Beacon Hill', 'Tidewater Terrace', 'Kelp Row', 'Pilot’s Walk', 'Harbour Parade', 'Salt Lane', 'Mill Race', 'Ferry Approach', 'Ropewalk', 'Cormorant Drive', 'Dune View', 'Old Signal Road']
export const FIRST = ['Ada', 'Bram', 'Carys', 'Dov', 'Elin', 'Farid', 'Greta', 'Hamish', 'Ines', 'Jonah', 'Kaia', 'Leif', 'Mirela', 'Nils', 'Oona', 'Piet', 'Quilla', 'Rhys', 'Saoirse', 'Teodor', 'Una', 'Valentin', 'Wren', 'Yara', 'Zeno', 'Amara', 'Bartek', 'Cosima', 'Desmond', 'Esra']
export const LAST = ['Ashcombe', 'Brannagh', 'Colvane', 'Drummel', 'Eversholt', 'Fairlie', 'Gorran', 'Halloway', 'Inchbald', 'Jessop', 'Kerrow', 'Lanyon', 'Marrick', 'Nantes-Oduya', 'Ollerton', 'Pendeen', 'Quarrie', 'Roskelly', 'Saltash-Mori', 'Trewin', 'Ulland', 'Vosper', 'Warleggan', 'Yelland', 'Zennor-Haas']
export const ORGANISATIONS: Partial<Record<AffectedService, readonly string[]>> = {
  maritime: ['Port of Harrowmere', 'Vellmark Coastguard', 'Brackwater Fishermen’s Co-op', 'Skerrow Ferries'],
  aeronautical: ['Harrowmere Fields Airfield', 'Vellmark Air Ambulance', 'Skerrow Isle Airstrip'],
  radionavigation: ['Harrowmere Fields Airfield', 'Vellmark Coastguard', 'Caddon Quay Pilots'],
  ppdr: ['Kestrel Bay Fire and Rescue', 'Vellmark Ambulance Service', 'Harrowmere Police'],
  broadcasting: ['Kestrel Bay Community Radio', 'Harrowmere Sound FM', 'Vellmark Broadcast Networks'],
  mobile_network: ['Tidewire Mobile', 'Northstrand Telecom', 'Coastline Cellular'],
  fixed_link: ['Saltmarsh Broadband Co-operative', 'Northstrand Telecom', 'Vellmark Water (telemetry)'],
  satellite_earth_station: ['Vellmark Teleport', 'Starling Down Ground Station'],
}
export const LICENCE_CODE: Record<AffectedService, string | null> = {
  aeronautical: 'AE',
  maritime: 'MS',
  radionavigation: 'AN',
  ppdr: 'PP',
  broadcasting: 'BC',
  mobile_network: 'MN',
  fixed_link: 'FX',
  satellite_earth_station: 'SE',
  amateur: null,
  licence_exempt: null,
  other: null,
}

/** Bands each service is reported in [Hz]; `other` spans the whole 100 kHz – 80 GHz range. */
export const BANDS_HZ: Record<AffectedService, readonly (readonly [number, number])[]> = {
  aeronautical: [[118e6, 137e6], [960e6, 1215e6], [4.2e9, 4.4e9]],
  maritime: [[156e6, 162.05e6], [2.1e6, 2.2e6], [9.2e9, 9.5e9]],
  radionavigation: [[108e6, 117.975e6], [1164e6, 1300e6], [1559e6, 1610e6], [2.7e9, 3.1e9]],
  ppdr: [[380e6, 400e6], [450e6, 470e6], [703e6, 788e6]],
  broadcasting: [[148.5e3, 283.5e3], [526.5e3, 1606.5e3], [87.5e6, 108e6], [174e6, 230e6], [470e6, 694e6], [11.7e9, 12.5e9]],
  mobile_network: [[703e6, 960e6], [1710e6, 1880e6], [1920e6, 2170e6], [2500e6, 2690e6], [3400e6, 3800e6], [24.25e9, 27.5e9]],
  fixed_link: [[5.925e9, 7.125e9], [10.7e9, 11.7e9], [17.7e9, 19.7e9], [21.2e9, 23.6e9], [37e9, 39.5e9], [71e9, 76e9]],
  satellite_earth_station: [[3.4e9, 4.2e9], [10.7e9, 12.75e9], [17.7e9, 21.2e9]],
  amateur: [[135.7e3, 137.8e3], [1.81e6, 2e6], [3.5e6, 3.8e6], [7e6, 7.2e6], [14e6, 14.35e6], [144e6, 146e6], [430e6, 440e6]],
  licence_exempt: [[26.957e6, 27.283e6], [433.05e6, 434.79e6], [863e6, 870e6], [2.4e9, 2.4835e9], [5.15e9, 5.875e9], [57e9, 66e9]],
  other: [[100e3, 80e9]],
}

export const SERVICE_WEIGHTS: readonly (readonly [AffectedService, number])[] = [
  ['mobile_network', 20], ['licence_exempt', 18], ['broadcasting', 15], ['amateur', 10], ['fixed_link', 8], ['maritime', 6],
  ['ppdr', 5], ['aeronautical', 4], ['radionavigation', 4], ['satellite_earth_station', 4], ['other', 6],
]

export const SOURCES = ['a faulty TV masthead amplifier', 'an unlicensed booster', 'a solar inverter', 'LED street lighting', 'a cordless phone', 'a wireless camera sender', 'an old baby monitor', 'a powerline network adapter', 'a signal blocker', 'a broken satellite receiver', 'an electric fence', 'a neighbour’s weather station', 'a car park barrier remote', 'a drone controller']
export const SYMPTOMS: Record<AffectedService, readonly string[]> = {
  aeronautical: ['Pilots report a carrier on the approach frequency', 'Air-ground radio is covered by a buzz on final approach'],
  maritime: ['VHF calling channel unreadable near the marina', 'Coast station hears constant hiss on the working channel'],
  radionavigation: ['Navigation receiver alarms several times a day', 'Satellite navigation drops out along the coast road'],
  ppdr: ['Crews lose contact with the control room', 'Repeater shows a strong signal on its receive band'],
  broadcasting: ['Radio station drowned by another one in the evenings', 'Television picture breaks up into blocks'],
  mobile_network: ['Calls drop and mobile data stalls', 'Uplink noise raised at the cell site'],
  fixed_link: ['Point-to-point link keeps losing sync', 'Link noise floor far too high'],
  satellite_earth_station: ['Carrier-to-noise of the downlink fell suddenly', 'Earth station receiver sees a spur in the band'],
  amateur: ['Noise with regular peaks covers the band during the day', 'Buzzing noise across the band since a few weeks'],
  licence_exempt: ['Wi-Fi slows down every evening', 'Garage door remote stopped working', 'Wireless doorbell rings on its own'],
  other: ['A strong unknown signal disturbs our equipment', 'Receiver desensitised at certain hours'],
}
export const FINDINGS: Record<Resolution, string> = {
  source_corrected: 'Source found and switched off or repaired by its owner.',
  enforcement_action: 'Unlicensed equipment found; taken out of use and enforcement action started.',
  no_interference_found: 'Measured on site: no interfering emission found.',
  referred: 'Not a matter of radio interference; passed to the competent authority.',
  withdrawn: 'Withdrawn by the complainant.',
  duplicate: 'Same interference as an open case; joined to it.',
}

// ---------------------------------------------------------------- how cases age

/** Share of cases that are closed, by age in days: old cases are almost all closed. */
export const CLOSED_SHARE_BY_AGE: readonly (readonly [minAgeDays: number, share: number])[] = [
  [90, 0.97],
  [30, 0.85],
  [7, 0.55],
  [2, 0.25],
  [0, 0.05],
]

/** The open state of a case received less than a day ago. */
export const OPEN_STATE_WEIGHTS_FIRST_DAY: readonly (readonly [CaseState, number])[] = [['received', 55], ['triaged', 25], ['assigned', 15], ['field_work', 5]]
/** The open state of an older open case. */
export const OPEN_STATE_WEIGHTS: readonly (readonly [CaseState, number])[] = [['received', 8], ['triaged', 14], ['assigned', 28], ['field_work', 25], ['finding_proposed', 15], ['returned', 10]]
/** How closed cases end. */
export const RESOLUTION_WEIGHTS: readonly (readonly [Resolution, number])[] = [['source_corrected', 45], ['no_interference_found', 20], ['enforcement_action', 8], ['referred', 10], ['withdrawn', 9], ['duplicate', 8]]

/** What complainants report they experience, and when the interference comes. */
export const EXPERIENCE_WEIGHTS: readonly (readonly [Experience, number])[] = [['outage', 30], ['degradation', 45], ['nuisance', 25]]
export const PATTERN_WEIGHTS: readonly (readonly [OccurrencePattern, number])[] = [['continuous', 40], ['intermittent', 40], ['certain_hours', 20]]
export const PATTERN_DETAILS = ['Evenings', 'Weekday working hours', 'Daylight hours', 'Around midnight']

/**
 * The invented licence register of the Vellmark Coast: `station-register.csv` beside this file
 * (written by `make-station-register.ts`, committed), the mapping of its columns an
 * administrator would choose, and the station the end-to-end scenario uses. Every licensee and
 * station is invented.
 */
import { fileURLToPath } from 'node:url'
import type { ColumnMapping } from '../../shared/schemas/stations'

export const DEMO_REGISTER_FILE = fileURLToPath(new URL('./station-register.csv', import.meta.url))
export const DEMO_REGISTER_FILE_NAME = 'vellmark-licence-register.csv'

/** The register's columns: centre and bandwidth, powers in the form each licence states them. */
export const DEMO_REGISTER_HEADERS = [
  'Licence no',
  'Licensee',
  'Service',
  'Latitude',
  'Longitude',
  'Antenna height (m)',
  'Centre frequency (MHz)',
  'Bandwidth (kHz)',
  'EIRP (dBW)',
  'ERP (W)',
  'Tx power (dBm)',
  'Antenna gain (dBi)',
  'Feeder loss (dB)',
  'Valid from',
  'Valid until',
] as const

export const DEMO_REGISTER_MAPPING: ColumnMapping = {
  fields: {
    stationCode: { column: 'Licence no' },
    licensee: { column: 'Licensee' },
    service: { column: 'Service' },
    latitude: { column: 'Latitude', unit: 'deg' },
    longitude: { column: 'Longitude', unit: 'deg' },
    antennaHeight: { column: 'Antenna height (m)', unit: 'm' },
    centreFreq: { column: 'Centre frequency (MHz)', unit: 'MHz' },
    bandwidth: { column: 'Bandwidth (kHz)', unit: 'kHz' },
    eirp: { column: 'EIRP (dBW)', unit: 'dBW' },
    erp: { column: 'ERP (W)', unit: 'W' },
    conductedPower: { column: 'Tx power (dBm)', unit: 'dBm' },
    antennaGain: { column: 'Antenna gain (dBi)', unit: 'dBi' },
    feederLoss: { column: 'Feeder loss (dB)', unit: 'dB' },
    validFrom: { column: 'Valid from' },
    validUntil: { column: 'Valid until' },
  },
}

/**
 * The scenario's licensed station: a PMR base at the Harrowmere marina, authorised 0 dBW
 * (30 dBm) EIRP on 446.1 MHz ± 100 kHz, i.e. 446.0–446.2 MHz.
 */
export const DEMO_SCENARIO_STATION = {
  stationCode: 'VM-PMR-0446',
  licensee: 'Harrowmere Marina Services Ltd',
  service: 'PMR base station',
  latitudeDeg: 48.1062,
  longitudeDeg: -31.3915,
  antennaHeightM: 14,
  lowFreqHz: 446_000_000,
  highFreqHz: 446_200_000,
  authorisedEirpDbm: 30,
} as const

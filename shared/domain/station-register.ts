/**
 * The licence register's import fields: the columns of an administrator's CSV can be mapped to
 * these, each with its kind and, for a number, the units a column may be read in. Labels are
 * the words the import screens and the row reports use.
 */

export const STATION_FIELDS = [
  'stationCode',
  'licensee',
  'service',
  'latitude',
  'longitude',
  'antennaHeight',
  'lowFreq',
  'highFreq',
  'centreFreq',
  'bandwidth',
  'eirp',
  'erp',
  'conductedPower',
  'antennaGain',
  'feederLoss',
  'validFrom',
  'validUntil',
] as const
export type StationField = (typeof STATION_FIELDS)[number]

/** What a field holds: text, a date (yyyy-mm-dd), or a number of one of these quantities. */
export type StationFieldKind = 'text' | 'date' | 'angle' | 'length' | 'frequency' | 'power' | 'gain' | 'loss'

/**
 * The units a number column may be read in. Frequencies, angles and lengths scale by a factor
 * (kHz = 1e3 Hz); logarithmic units are offsets (dBW = dBm + 30, dBd = dBi + 2.15); powers in
 * watts are turned into dBm (10·log10(P / 1 mW)).
 */
export const STATION_UNITS = {
  frequency: ['Hz', 'kHz', 'MHz', 'GHz'],
  angle: ['deg'],
  length: ['m', 'km'],
  power: ['dBm', 'dBW', 'W', 'mW', 'kW'],
  gain: ['dBi', 'dBd'],
  loss: ['dB'],
} as const satisfies Partial<Record<StationFieldKind, readonly string[]>>
export type NumberFieldKind = keyof typeof STATION_UNITS

export interface StationFieldInfo {
  label: string
  kind: StationFieldKind
  /** The unit a column of this field is read in unless the administrator picks another. */
  defaultUnit?: string
}

export const STATION_FIELD_INFO: Record<StationField, StationFieldInfo> = {
  stationCode: { label: 'Station code', kind: 'text' },
  licensee: { label: 'Licensee', kind: 'text' },
  service: { label: 'Service', kind: 'text' },
  latitude: { label: 'Latitude', kind: 'angle', defaultUnit: 'deg' },
  longitude: { label: 'Longitude', kind: 'angle', defaultUnit: 'deg' },
  antennaHeight: { label: 'Antenna height', kind: 'length', defaultUnit: 'm' },
  lowFreq: { label: 'Low frequency', kind: 'frequency', defaultUnit: 'MHz' },
  highFreq: { label: 'High frequency', kind: 'frequency', defaultUnit: 'MHz' },
  centreFreq: { label: 'Centre frequency', kind: 'frequency', defaultUnit: 'MHz' },
  bandwidth: { label: 'Bandwidth', kind: 'frequency', defaultUnit: 'kHz' },
  eirp: { label: 'EIRP', kind: 'power', defaultUnit: 'dBm' },
  erp: { label: 'ERP', kind: 'power', defaultUnit: 'dBm' },
  conductedPower: { label: 'Conducted power', kind: 'power', defaultUnit: 'dBm' },
  antennaGain: { label: 'Antenna gain', kind: 'gain', defaultUnit: 'dBi' },
  feederLoss: { label: 'Feeder loss', kind: 'loss', defaultUnit: 'dB' },
  validFrom: { label: 'Valid from', kind: 'date' },
  validUntil: { label: 'Valid until', kind: 'date' },
}

export const isNumberField = (kind: StationFieldKind): kind is NumberFieldKind => kind in STATION_UNITS

/** The delimiters a register CSV may use, by name (the API and the database carry the names). */
export const CSV_DELIMITERS = ['comma', 'semicolon', 'tab', 'bar'] as const
export type CsvDelimiter = (typeof CSV_DELIMITERS)[number]
export const CSV_DELIMITER_CHARS: Record<CsvDelimiter, string> = { comma: ',', semicolon: ';', tab: '\t', bar: '|' }
export const CSV_DELIMITER_LABELS: Record<CsvDelimiter, string> = { comma: 'Comma (,)', semicolon: 'Semicolon (;)', tab: 'Tab', bar: 'Vertical bar (|)' }

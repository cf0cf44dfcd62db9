/**
 * The office's antennas and instruments register, and what a measurement records about how it
 * was taken: the lists (used by the database's CHECKs, the schemas and the forms) and their labels.
 */

/** What an item of the register is. */
export const EQUIPMENT_TYPES = ['antenna', 'analyser', 'receiver', 'cable', 'preamplifier', 'attenuator', 'other'] as const
export type EquipmentType = (typeof EQUIPMENT_TYPES)[number]
export const EQUIPMENT_TYPE_LABELS: Record<EquipmentType, string> = {
  antenna: 'Antenna',
  analyser: 'Spectrum analyser',
  receiver: 'Measuring receiver',
  cable: 'Cable',
  preamplifier: 'Preamplifier',
  attenuator: 'Attenuator',
  other: 'Other',
}
/** Types that read a level (a measurement's instrument). */
export const INSTRUMENT_TYPES: readonly EquipmentType[] = ['analyser', 'receiver']

/** The detector the instrument used. */
export const DETECTORS = ['peak', 'rms', 'average', 'quasi_peak'] as const
export type Detector = (typeof DETECTORS)[number]
export const DETECTOR_LABELS: Record<Detector, string> = {
  peak: 'Peak',
  rms: 'RMS',
  average: 'Average',
  quasi_peak: 'Quasi-peak',
}

export const POLARISATIONS = ['vertical', 'horizontal', 'other'] as const
export type Polarisation = (typeof POLARISATIONS)[number]
export const POLARISATION_LABELS: Record<Polarisation, string> = {
  vertical: 'Vertical',
  horizontal: 'Horizontal',
  other: 'Other (circular, slant…)',
}

/**
 * What the reading is: a power or a voltage at the instrument's input (the chain's corrections
 * and the antenna turn it into a field), or a level already in the field (a field-strength meter
 * with its antenna factor applied, or a probe).
 */
export const READING_UNITS = ['dBm', 'dBµV', 'dBµV/m', 'dBW/m²'] as const
export type ReadingUnit = (typeof READING_UNITS)[number]
export const READING_UNIT_LABELS: Record<ReadingUnit, string> = {
  dBm: 'Power at the instrument input (dBm)',
  'dBµV': 'Voltage at the instrument input (dBµV)',
  'dBµV/m': 'Field strength (dBµV/m, antenna already applied)',
  'dBW/m²': 'Power flux density (dBW/m², antenna already applied)',
}
/** Readings taken at the instrument's input: they need the antenna and the chain's corrections. */
export const INPUT_READING_UNITS: readonly ReadingUnit[] = ['dBm', 'dBµV']

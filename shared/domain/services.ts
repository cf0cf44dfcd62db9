/**
 * The radio services a complainant can say are affected, and the priorities of the brief.
 * Safety services come first (ITU Radio Regulations No. 1.169: harmful interference
 * "endangers the functioning of a radionavigation service or of other safety services").
 */
export const AFFECTED_SERVICES = [
  'aeronautical',
  'maritime',
  'radionavigation',
  'ppdr',
  'broadcasting',
  'mobile_network',
  'fixed_link',
  'satellite_earth_station',
  'amateur',
  'licence_exempt',
  'other',
] as const
export type AffectedService = (typeof AFFECTED_SERVICES)[number]

export const SERVICE_LABELS: Record<AffectedService, string> = {
  aeronautical: 'Aeronautical (air-ground radio, aircraft systems)',
  maritime: 'Maritime (ship and coast radio, distress and safety)',
  radionavigation: 'Radionavigation (navigation aids, satellite navigation, radar)',
  ppdr: 'Public protection and disaster relief (police, fire, ambulance)',
  broadcasting: 'Broadcasting (radio or television reception)',
  mobile_network: 'Mobile network',
  fixed_link: 'Fixed link (point-to-point radio)',
  satellite_earth_station: 'Satellite earth station',
  amateur: 'Amateur radio',
  licence_exempt: 'Licence-exempt use (Wi-Fi, short-range devices)',
  other: 'Other',
}

/** Services whose harm endangers life: priority 1 whatever the complainant experiences. */
export const SAFETY_SERVICES: readonly AffectedService[] = ['aeronautical', 'maritime', 'radionavigation', 'ppdr']

export const EXPERIENCES = ['outage', 'degradation', 'nuisance'] as const
export type Experience = (typeof EXPERIENCES)[number]
export const EXPERIENCE_LABELS: Record<Experience, string> = {
  outage: 'The service is lost (outage)',
  degradation: 'The service works badly (degradation)',
  nuisance: 'Noise or nuisance, the service still works',
}

export const OCCURRENCE_PATTERNS = ['continuous', 'intermittent', 'certain_hours'] as const
export type OccurrencePattern = (typeof OCCURRENCE_PATTERNS)[number]
export const OCCURRENCE_LABELS: Record<OccurrencePattern, string> = {
  continuous: 'All the time',
  intermittent: 'On and off',
  certain_hours: 'At certain hours',
}

export const PRIORITIES = [1, 2, 3, 4] as const
export type Priority = (typeof PRIORITIES)[number]
/**
 * The words of each priority, which people see as a harm class: `short` is the class's name
 * (badges, options, e-mails), `long` says what it covers where there is room. Stored values,
 * the `priority` API parameter and the CSV keep the figures 1–4; people read the names.
 */
export const PRIORITY_LABELS: Record<Priority, { short: string; long: string }> = {
  1: { short: 'Safety of life', long: 'A safety-of-life service is endangered (aeronautical, maritime distress and safety, radionavigation, public protection)' },
  2: { short: 'Service lost', long: 'A licensed service cannot be used at all' },
  3: { short: 'Service degraded', long: 'A licensed service works, but worse' },
  4: { short: 'Nuisance', long: 'Licence-exempt use, or a nuisance that stops no service' },
}

/** A harm class named for a sentence: "Safety of life (class 1)". */
export const harmClassText = (p: Priority) => `${PRIORITY_LABELS[p].short} (class ${p})`

/**
 * The priority a new report suggests: 1 for a safety service; otherwise licence-exempt use
 * is 4, and a licensed service is 2 when lost, 3 when degraded, 4 for a nuisance.
 * The supervisor confirms or changes it at triage.
 */
export function suggestPriority(service: AffectedService, experience: Experience): Priority {
  if (SAFETY_SERVICES.includes(service)) return 1
  if (service === 'licence_exempt') return 4
  if (experience === 'outage') return 2
  if (experience === 'degradation') return 3
  return 4
}

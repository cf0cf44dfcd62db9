/** Levels as people read them: one decimal, a true minus sign, the unit after a thin space. */
export function formatLevel(value: number | undefined, unit: string, digits = 1): string {
  if (value === undefined || !Number.isFinite(value)) return '—'
  return `${value.toFixed(digits).replace('-', '\u2212')} ${unit}`
}

/** The three derived levels, in the order the list and the live panel show them. */
export const LEVELS = [
  { key: 'fieldStrengthDbuvPerM', label: 'Field strength', unit: 'dBµV/m' },
  { key: 'pfdDbwPerM2', label: 'Power flux density', unit: 'dBW/m²' },
  { key: 'isotropicReceivedPowerDbm', label: 'Isotropic received power', unit: 'dBm' },
] as const

/**
 * A stored output's path in words with its unit, for the recompute table: `value.erpW` →
 * "ERP [W]", `value.budget.rows.0.contribution` → "budget › rows › 1 › contribution".
 */
const SUFFIXES: [string, string][] = [
  ['DbuvPerM', 'dBµV/m'],
  ['DbwPerM2', 'dBW/m²'],
  ['WPerM2', 'W/m²'],
  ['Dbm', 'dBm'],
  ['Dbi', 'dBi'],
  ['Db', 'dB'],
  ['Hz', 'Hz'],
  ['Deg', '°'],
  ['M', 'm'],
  ['W', 'W'],
]

const ACRONYMS: Record<string, string> = { eirp: 'EIRP', erp: 'ERP', inr: 'I/N', lat: 'latitude', lon: 'longitude' }

function words(camel: string): string {
  return camel
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .split(' ')
    .map((w) => ACRONYMS[w] ?? w)
    .join(' ')
}

export function outputPathLabel(path: string): string {
  const parts = path.split('.')
  if (parts[0] === 'value') parts.shift()
  const last = parts.pop() ?? path
  const suffix = SUFFIXES.find(([s]) => last.endsWith(s) && last.length > s.length && /[a-z0-9]/.test(last[last.length - s.length - 1]!))
  const name = words(suffix ? last.slice(0, -suffix[0].length) : last)
  const where = parts.map((p) => (/^\d+$/.test(p) ? String(Number(p) + 1) : words(p)))
  return `${[...where, name].join(' › ')}${suffix ? ` [${suffix[1]}]` : ''}`
}

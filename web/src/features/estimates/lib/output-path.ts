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

/** A key's name in words and the unit its suffix names, if any. */
function split(key: string): { name: string; unit: string | null } {
  const suffix = SUFFIXES.find(([s]) => key.endsWith(s) && key.length > s.length && /[a-z0-9]/.test(key[key.length - s.length - 1]!))
  return { name: words(suffix ? key.slice(0, -suffix[0].length) : key), unit: suffix ? suffix[1] : null }
}

export function outputPathLabel(path: string): string {
  const parts = path.split('.')
  if (parts[0] === 'value') parts.shift()
  const last = split(parts.pop() ?? path)
  const where = parts.map((p) => (/^\d+$/.test(p) ? String(Number(p) + 1) : split(p).name))
  return `${[...where, last.name].join(' › ')}${last.unit ? ` [${last.unit}]` : ''}`
}

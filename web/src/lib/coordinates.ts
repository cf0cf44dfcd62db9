/** Latitude and longitude as field staff read them: decimal degrees with a hemisphere letter. */

/** "48.1000° N, 31.3500° W" (4 decimals ≈ 11 m of latitude). */
export function formatLatLonDeg(options: { latDeg: number; lonDeg: number; decimals?: number }): string {
  const { latDeg, lonDeg, decimals = 4 } = options
  const lat = `${Math.abs(latDeg).toFixed(decimals)}° ${latDeg < 0 ? 'S' : 'N'}`
  const lon = `${Math.abs(lonDeg).toFixed(decimals)}° ${lonDeg < 0 ? 'W' : 'E'}`
  return `${lat}, ${lon}`
}

/** A distance in metres as "850 m" or "4.3 km". */
export function formatDistanceM(distanceM: number): string {
  if (!Number.isFinite(distanceM)) return '—'
  return distanceM < 1000 ? `${Math.round(distanceM)} m` : `${(distanceM / 1000).toFixed(1)} km`
}

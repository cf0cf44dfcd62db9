/**
 * Where the measurement was taken: typed (decimal degrees), from this device's location when
 * the investigator allows it, or picked on the map. Each way fills the same two fields.
 */
import { useState } from 'react'
import { FieldMap } from '@/components/map'
import { Button } from '@/components/ui/button'
import { QuantityField, type QuantityValue } from '@/components/ui/quantity-field'
import { readQuantity, withUnit } from '@shared/schemas/quantities'

const GEO_ERRORS: Record<number, string> = {
  1: 'Location access was refused on this device. Type the position, or pick it on the map. (To allow it, change the site’s location permission in the browser settings.)',
  2: 'This device could not find its position just now (no satellite or network fix). Type the position, or pick it on the map.',
  3: 'Finding the position took too long. Try again in the open, or type the position.',
}

function pointOf(lat: QuantityValue, lon: QuantityValue) {
  const a = readQuantity(withUnit(lat.figure, lat.unit), 'angle', { label: 'latitude', min: -90, max: 90 })
  const b = readQuantity(withUnit(lon.figure, lon.unit), 'angle', { label: 'longitude', min: -180, max: 180 })
  return a.ok && b.ok ? { latDeg: a.value, lonDeg: b.value } : null
}

export function PositionFields({
  lat,
  lon,
  onChange,
  errors,
  casePoint,
}: {
  lat: QuantityValue
  lon: QuantityValue
  onChange: (lat: QuantityValue, lon: QuantityValue) => void
  errors: { lat?: string; lon?: string }
  /** The complainant's position, shown on the map for orientation. */
  casePoint: { latDeg: number; lonDeg: number }
}) {
  const [geo, setGeo] = useState<{ state: 'idle' | 'finding' | 'found' | 'failed'; message?: string }>({ state: 'idle' })
  const [mapOpen, setMapOpen] = useState(false)
  const set = (latDeg: number, lonDeg: number) => onChange({ figure: latDeg.toFixed(6), unit: '°' }, { figure: lonDeg.toFixed(6), unit: '°' })

  function useDevice() {
    if (!('geolocation' in navigator)) {
      setGeo({ state: 'failed', message: 'This browser cannot give a position. Type it, or pick it on the map.' })
      return
    }
    setGeo({ state: 'finding' })
    navigator.geolocation.getCurrentPosition(
      (p) => {
        set(p.coords.latitude, p.coords.longitude)
        setGeo({ state: 'found', message: `Position from this device, to within about ${Math.round(p.coords.accuracy)} m.` })
      },
      (e) => setGeo({ state: 'failed', message: GEO_ERRORS[e.code] ?? 'The position could not be found. Type it, or pick it on the map.' }),
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 30_000 },
    )
  }

  const here = pointOf(lat, lon)
  return (
    <fieldset className="flex min-w-0 flex-col gap-3">
      <legend className="text-lg font-semibold">Position</legend>
      <div className="grid grid-cols-1 gap-4 @2xl:grid-cols-2">
        <QuantityField label="Latitude" name="latDeg" kind="angle" value={lat} onChange={(v) => onChange(v, lon)} error={errors.lat} hint="Decimal degrees, north positive (WGS 84)." />
        <QuantityField label="Longitude" name="lonDeg" kind="angle" value={lon} onChange={(v) => onChange(lat, v)} error={errors.lon} hint="Decimal degrees, east positive." />
      </div>
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" onClick={useDevice} disabled={geo.state === 'finding'}>
          {geo.state === 'finding' ? 'Finding this device’s position…' : 'Use this device’s position'}
        </Button>
        <Button variant="secondary" aria-expanded={mapOpen} onClick={() => setMapOpen((o) => !o)}>
          {mapOpen ? 'Close the map' : 'Pick on the map'}
        </Button>
      </div>
      {geo.message && (
        <p role="status" className={`text-sm ${geo.state === 'failed' ? 'font-semibold text-danger' : 'text-ink-muted'}`}>
          {geo.message}
        </p>
      )}
      {mapOpen && (
        <div className="flex flex-col gap-2">
          <FieldMap
            label="Map to pick the measurement position"
            heightPx={320}
            victim={here ? { at: here, label: 'Measurement position' } : { at: casePoint, label: 'Complainant’s position' }}
            onPick={(latDeg, lonDeg) => {
              set(latDeg, lonDeg)
              setGeo({ state: 'idle', message: 'Position picked on the map (to about 11 m).' })
            }}
          />
        </div>
      )}
    </fieldset>
  )
}

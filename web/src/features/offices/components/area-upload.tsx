/**
 * The area from GeoJSON: a file (.geojson or .json, read in the browser) or pasted text (folded
 * away until asked for). Whatever is wrong with it is said beside the field it came from; a
 * good area replaces the drawn one.
 */
import { useId, useState, type ChangeEvent } from 'react'
import { areaFromGeoJsonText } from '@shared/domain/office-areas'
import type { AreaGeometry } from '@shared/schemas/region'
import { Button } from '@/components/ui/button'
import { Field } from '@/components/ui/field'
import { TextAreaField } from '@/components/ui/text-area-field'

/** A file's text (Blob.text where the browser has it, FileReader otherwise). */
function readText(file: File): Promise<string> {
  if (typeof file.text === 'function') return file.text()
  return new Promise((resolve, reject) => {
    const reader = new FileReader()
    reader.onload = () => resolve(String(reader.result ?? ''))
    reader.onerror = () => reject(reader.error ?? new Error('unreadable'))
    reader.readAsText(file)
  })
}

export function AreaUpload({ onArea }: { onArea: (area: AreaGeometry, from: string) => void }) {
  const id = useId()
  const [fileError, setFileError] = useState<string | undefined>()
  const [pasteError, setPasteError] = useState<string | undefined>()
  const [pasted, setPasted] = useState('')

  const onFile = async (e: ChangeEvent<HTMLInputElement>) => {
    const file = e.target.files?.[0]
    setFileError(undefined)
    if (!file) return
    let text: string
    try {
      text = await readText(file)
    } catch {
      setFileError('The file could not be read. Choose it again.')
      return
    }
    const read = areaFromGeoJsonText(text)
    if ('error' in read) setFileError(read.error)
    else onArea(read.area, file.name)
  }
  const onPaste = () => {
    const read = areaFromGeoJsonText(pasted)
    if ('error' in read) return setPasteError(read.error.replace(/^The file/, 'The text'))
    setPasteError(undefined)
    onArea(read.area, 'the pasted GeoJSON')
  }

  return (
    <div className="flex flex-col gap-4">
      <Field id={`${id}-file`} label="Or upload a GeoJSON file" hint="A .geojson or .json file holding one Polygon or MultiPolygon (a geometry, a Feature, or a collection of exactly one). It replaces the drawn area." error={fileError}>
        <input
          id={`${id}-file`}
          type="file"
          accept=".geojson,.json,application/geo+json,application/json"
          aria-invalid={fileError ? true : undefined}
          aria-describedby={[`${id}-file-hint`, fileError && `${id}-file-error`].filter(Boolean).join(' ')}
          className="min-h-11 max-w-full text-ink file:mr-3 file:min-h-11 file:rounded-control file:border file:border-field file:bg-surface file:px-4 file:font-semibold"
          onChange={(e) => void onFile(e)}
        />
      </Field>
      <details className="rounded-control border border-rule px-4 py-2">
        <summary className="min-h-11 cursor-pointer py-2 font-semibold">Or paste GeoJSON</summary>
        <div className="flex flex-col gap-3 pb-2">
          <TextAreaField
            id={`${id}-paste`}
            name="areaGeoJson"
            label="GeoJSON text"
            rows={6}
            className="font-mono text-sm"
            hint='For example {"type": "Polygon", "coordinates": [[[-31.5, 48.0], …]]}: positions are [longitude, latitude].'
            error={pasteError}
            value={pasted}
            onChange={(e) => setPasted(e.target.value)}
          />
          <div>
            <Button variant="secondary" onClick={onPaste} disabled={!pasted.trim()}>
              Use this GeoJSON
            </Button>
          </div>
        </div>
      </details>
    </div>
  )
}

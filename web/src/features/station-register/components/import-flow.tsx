/**
 * Importing a new version of the licence register (administrators), in four steps: choose the
 * CSV (the server keeps it and reads its top) → say what each column holds and its unit →
 * check every row (rejected rows by line) → make the new version. Nothing changes in the
 * register before the last step, and the server reads the stored file again at every step.
 */
import { useRef, useState, type FormEvent } from 'react'
import { CSV_DELIMITER_LABELS, CSV_DELIMITERS, STATION_FIELD_INFO, STATION_FIELDS, STATION_UNITS, isNumberField, type CsvDelimiter, type StationField } from '@shared/domain/station-register'
import { mappingProblems, type ColumnMapping, type ColumnMappingFields, type CsvInspectionView, type ImportReportView, type RegisterVersionView } from '@shared/schemas/stations'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { Notice } from '@/components/ui/notice'
import { SelectField } from '@/components/ui/select-field'
import { TableFrame } from '@/components/ui/table'
import { formProblem, type FormProblem } from '@/lib/form-errors'
import { isApiError } from '@/lib/api-client'
import { useConfirmImport, useInspectUpload, usePreviewImport, useUploadRegister } from '../api/import-register'
import { describeLicence, formatDbm, formatRange } from '../lib/format'
import { RejectedRows } from './rejected-rows'

type Step =
  | { kind: 'choose' }
  | { kind: 'map'; inspection: CsvInspectionView }
  | { kind: 'preview'; inspection: CsvInspectionView; report: ImportReportView; mapping: ColumnMapping }
  | { kind: 'done'; version: RegisterVersionView; report: ImportReportView }

/** What each column holds: a field (or nothing) and, for a number, its unit. */
type ColumnChoices = Record<string, { field: StationField | ''; unit: string }>

function choicesFrom(inspection: CsvInspectionView): ColumnChoices {
  const choices: ColumnChoices = Object.fromEntries(inspection.headers.map((h) => [h, { field: '' as const, unit: '' }]))
  for (const [field, m] of Object.entries(inspection.suggestedMapping.fields)) {
    if (m && choices[m.column]) choices[m.column] = { field: field as StationField, unit: m.unit ?? '' }
  }
  return choices
}

function mappingFrom(choices: ColumnChoices): ColumnMapping {
  const fields: ColumnMappingFields = {}
  for (const [column, c] of Object.entries(choices)) {
    if (!c.field) continue
    const kind = STATION_FIELD_INFO[c.field].kind
    fields[c.field] = isNumberField(kind) ? { column, unit: c.unit || STATION_FIELD_INFO[c.field].defaultUnit } : { column }
  }
  return { fields }
}

/** A failed step's message, with the server's list of problems when it gave one. */
function Problem({ problem, error }: { problem: FormProblem | null; error: unknown }) {
  if (!problem) return null
  const details = isApiError(error) ? error.details : []
  return (
    <div className="flex flex-col gap-2">
      <FormAlert problem={problem} />
      {details.length > 0 && (
        <ul className="list-disc pl-6">
          {details.map((d, i) => (
            <li key={i}>{d.message}</li>
          ))}
        </ul>
      )}
    </div>
  )
}

function ChooseFile({ onInspected }: { onInspected: (i: CsvInspectionView) => void }) {
  const upload = useUploadRegister()
  const fileRef = useRef<HTMLInputElement>(null)
  const [delimiter, setDelimiter] = useState<CsvDelimiter | ''>('')
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const submit = (e: FormEvent) => {
    e.preventDefault()
    const file = fileRef.current?.files?.[0]
    if (!file) {
      setProblem({ message: 'Choose the register’s CSV file first.', requestId: null })
      return
    }
    setProblem(null)
    upload.mutate(
      { file, delimiter: delimiter || undefined },
      { onSuccess: onInspected, onError: (e) => setProblem(formProblem(e, { byCode: { storage_unavailable: 'The file store cannot be reached, so nothing was stored. Try again in a moment.' } })) },
    )
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-4">
      <div className="flex flex-col gap-1">
        <label htmlFor="register-file" className="font-semibold">
          Register file (CSV with a header row)
        </label>
        <input ref={fileRef} id="register-file" name="file" type="file" accept=".csv,.txt,text/csv" className="min-h-11 max-w-full" />
      </div>
      <SelectField
        label="Delimiter"
        name="delimiter"
        value={delimiter}
        onChange={(e) => setDelimiter(e.target.value as CsvDelimiter | '')}
        options={[{ value: '', label: 'Find it from the header row' }, ...CSV_DELIMITERS.map((d) => ({ value: d, label: CSV_DELIMITER_LABELS[d] }))]}
      />
      <Problem problem={problem} error={upload.error} />
      <div>
        <Button type="submit" disabled={upload.isPending}>
          {upload.isPending ? 'Uploading…' : 'Upload and read the columns'}
        </Button>
      </div>
    </form>
  )
}

function MapColumns({ inspection, onInspected, onPreviewed, onCancel }: { inspection: CsvInspectionView; onInspected: (i: CsvInspectionView) => void; onPreviewed: (r: ImportReportView, i: CsvInspectionView, m: ColumnMapping) => void; onCancel: () => void }) {
  const [choices, setChoices] = useState<ColumnChoices>(() => choicesFrom(inspection))
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const inspect = useInspectUpload()
  const preview = usePreviewImport()
  const mapping = mappingFrom(choices)
  const mappingIssues = mappingProblems(mapping.fields)
  const taken = new Map(Object.entries(choices).flatMap(([column, c]) => (c.field ? [[c.field, column] as const] : [])))

  const setColumn = (column: string, next: Partial<{ field: StationField | ''; unit: string }>) =>
    setChoices((cs) => {
      const merged = { ...cs[column]!, ...next }
      if (next.field !== undefined) merged.unit = next.field ? (STATION_FIELD_INFO[next.field].defaultUnit ?? '') : ''
      return { ...cs, [column]: merged }
    })

  const reread = (delimiter: CsvDelimiter) =>
    inspect.mutate(
      { fileId: inspection.file.id, delimiter },
      {
        onSuccess: (i) => {
          setChoices(choicesFrom(i))
          onInspected(i)
        },
        onError: (e) => setProblem(formProblem(e)),
      },
    )

  const check = () => {
    setProblem(null)
    preview.mutate({ fileId: inspection.file.id, delimiter: inspection.delimiter, mapping }, { onSuccess: (r) => onPreviewed(r, inspection, mapping), onError: (e) => setProblem(formProblem(e)) })
  }

  return (
    <div className="flex flex-col gap-4">
      <p>
        <span className="font-semibold">{inspection.file.originalName}</span> ({inspection.file.sizeBytes} bytes, SHA-256 <span className="break-all">{inspection.file.sha256}</span>)
      </p>
      <div className="max-w-sm">
        <SelectField
          label="Delimiter"
          name="delimiter-again"
          value={inspection.delimiter}
          onChange={(e) => reread(e.target.value as CsvDelimiter)}
          hint={inspection.delimiterDetected ? 'Found from the header row; change it if the columns look wrong.' : undefined}
          options={CSV_DELIMITERS.map((d) => ({ value: d, label: CSV_DELIMITER_LABELS[d] }))}
        />
      </div>
      {inspection.notes.length > 0 && (
        <Notice tone="caution" title="Check these">
          <ul className="list-disc pl-5">
            {inspection.notes.map((n, i) => (
              <li key={i}>{n}</li>
            ))}
          </ul>
        </Notice>
      )}
      <ul className="flex flex-col gap-3">
        {inspection.headers.map((header, i) => {
          const c = choices[header]!
          const kind = c.field ? STATION_FIELD_INFO[c.field].kind : undefined
          const units: readonly string[] = kind && isNumberField(kind) ? STATION_UNITS[kind] : []
          const sample = inspection.sampleRows.map((r) => r.cells[i] ?? '').filter(Boolean).slice(0, 3).join(' · ')
          return (
            <li key={header} className="grid items-end gap-3 rounded-panel border border-rule bg-surface p-3 md:grid-cols-[minmax(0,1fr)_16rem_10rem]">
              <div className="min-w-0">
                <p className="font-semibold break-words">{header}</p>
                <p className="text-sm break-words text-ink-muted">{sample ? `e.g. ${sample}` : 'empty in the first rows'}</p>
              </div>
              <SelectField
                label={`What “${header}” holds`}
                name={`field-${i}`}
                id={`column-field-${i}`}
                value={c.field}
                onChange={(e) => setColumn(header, { field: e.target.value as StationField | '' })}
                options={[
                  { value: '', label: 'Not imported' },
                  ...STATION_FIELDS.filter((f) => f === c.field || !taken.has(f)).map((f) => ({ value: f, label: STATION_FIELD_INFO[f].label })),
                ]}
              />
              {units.length > 0 ? (
                <SelectField label="Unit" name={`unit-${i}`} id={`column-unit-${i}`} value={c.unit} onChange={(e) => setColumn(header, { unit: e.target.value })} options={units.map((u) => ({ value: u, label: u === 'deg' ? 'degrees' : u }))} />
              ) : (
                <span aria-hidden="true" />
              )}
            </li>
          )
        })}
      </ul>
      {mappingIssues.length > 0 && (
        <Notice tone="caution" title="Before the rows can be checked">
          <ul className="list-disc pl-5">
            {mappingIssues.map((p, i) => (
              <li key={i}>{p.message}</li>
            ))}
          </ul>
        </Notice>
      )}
      <Problem problem={problem} error={preview.error ?? inspect.error} />
      <div className="flex flex-wrap gap-3">
        <Button onClick={check} disabled={mappingIssues.length > 0 || preview.isPending}>
          {preview.isPending ? 'Checking every row…' : 'Check every row'}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Choose another file
        </Button>
      </div>
    </div>
  )
}

function Preview({ inspection, report, mapping, onBack, onDone }: { inspection: CsvInspectionView; report: ImportReportView; mapping: ColumnMapping; onBack: () => void; onDone: (v: RegisterVersionView, r: ImportReportView) => void }) {
  const confirm = useConfirmImport()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  return (
    <div className="flex flex-col gap-4">
      <p aria-live="polite">
        {report.rowCount} rows read: <span className="font-semibold">{report.acceptedCount} can be imported</span>, {report.rejectedCount} rejected.
      </p>
      <RejectedRows rows={report.rejected} total={report.rejectedCount} />
      {report.sample.length > 0 && (
        <TableFrame
          caption="The first rows as they will be stored"
          head={
            <tr>
              {['Line', 'Code', 'Licensee', 'Frequencies', 'Licence', 'Authorised EIRP'].map((h) => (
                <th key={h} scope="col" className="px-3 py-2">
                  {h}
                </th>
              ))}
            </tr>
          }
        >
          {report.sample.map((s) => (
            <tr key={s.line} className="border-b border-rule align-top">
              <td className="px-3 py-2">{s.line}</td>
              <td className="px-3 py-2 font-mono text-sm">{s.stationCode}</td>
              <td className="px-3 py-2">{s.licensee}</td>
              <td className="px-3 py-2 whitespace-nowrap">{formatRange(s)}</td>
              <td className="px-3 py-2">{describeLicence(s)}</td>
              <td className="px-3 py-2 whitespace-nowrap">{formatDbm(s.authorisedEirpDbm)}</td>
            </tr>
          ))}
        </TableFrame>
      )}
      <Problem problem={problem} error={confirm.error} />
      <div className="flex flex-wrap gap-3">
        <Button
          disabled={report.acceptedCount === 0 || confirm.isPending}
          onClick={() => {
            setProblem(null)
            confirm.mutate(
              { fileId: inspection.file.id, delimiter: report.delimiter, mapping },
              { onSuccess: (r) => onDone(r.version, r.report), onError: (e) => setProblem(formProblem(e)) },
            )
          }}
        >
          {confirm.isPending ? 'Importing…' : `Make the new version with ${report.acceptedCount} stations`}
        </Button>
        <Button variant="secondary" onClick={onBack}>
          Back to the columns
        </Button>
      </div>
    </div>
  )
}

export function ImportFlow() {
  const [step, setStep] = useState<Step>({ kind: 'choose' })
  return (
    <section aria-labelledby="import-heading" className="flex flex-col gap-4 rounded-panel border border-rule bg-surface p-4 sm:p-5">
      <h2 id="import-heading" className="text-xl font-semibold">
        Import a new version
      </h2>
      <ol className="flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink-muted" aria-label="Steps">
        {['Choose the file', 'Say what each column holds', 'Check every row', 'Make the version'].map((label, i) => {
          const current = ['choose', 'map', 'preview', 'done'].indexOf(step.kind) === i
          return (
            <li key={label} aria-current={current ? 'step' : undefined} className={current ? 'font-semibold text-ink' : undefined}>
              {i + 1}. {label}
            </li>
          )
        })}
      </ol>
      {step.kind === 'choose' && <ChooseFile onInspected={(inspection) => setStep({ kind: 'map', inspection })} />}
      {step.kind === 'map' && (
        <MapColumns
          key={`${step.inspection.file.id}-${step.inspection.delimiter}`}
          inspection={step.inspection}
          onInspected={(inspection) => setStep({ kind: 'map', inspection })}
          onPreviewed={(report, inspection, mapping) => setStep({ kind: 'preview', inspection, report, mapping })}
          onCancel={() => setStep({ kind: 'choose' })}
        />
      )}
      {step.kind === 'preview' && <Preview inspection={step.inspection} report={step.report} mapping={step.mapping} onBack={() => setStep({ kind: 'map', inspection: step.inspection })} onDone={(version, report) => setStep({ kind: 'done', version, report })} />}
      {step.kind === 'done' && (
        <div className="flex flex-col gap-3">
          <Notice tone="ok" live title={`Version ${step.version.version} is the register in force`}>
            <p>
              {step.version.acceptedCount} stations imported, {step.version.rejectedCount} rows rejected. Older versions are kept as they were; calculations keep the rows they used.
            </p>
          </Notice>
          <div>
            <Button variant="secondary" onClick={() => setStep({ kind: 'choose' })}>
              Import another file
            </Button>
          </div>
        </div>
      )}
    </section>
  )
}

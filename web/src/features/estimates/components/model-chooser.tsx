/**
 * The propagation model: the kinds a calculation may name (the shared input schema's list),
 * each explained from the library's descriptors — when to use it, its parameters with their
 * defaults, the ranges it is valid for and the source of each.
 */
import type { z } from 'zod'
import { propagationModelSpec } from '@shared/calculations/inputs'
import { PROPAGATION_MODEL_DESCRIPTORS, type ModelParameterDescriptor, type PropagationModelDescriptor } from '@shared/radio'
import { withoutBranch, type FormState } from '../lib/form-state'
import { U, fmtBound } from '../lib/units'
import { ChoiceField, QField, useEstimateForm, FIELD_GRID } from './form-controls'

type Option = z.ZodObject<{ kind: z.ZodLiteral<string> } & z.ZodRawShape>

/** Each model the schema takes, and the keys of its spec. */
const SCHEMA_MODELS: Map<string, Set<string>> = new Map(
  (propagationModelSpec.options as unknown as Option[]).map((o) => [String(o.shape.kind.value), new Set(Object.keys(o.shape))]),
)

/** The models offered: described by the library and taken by the schema. */
export const OFFERED_MODELS: PropagationModelDescriptor[] = PROPAGATION_MODEL_DESCRIPTORS.filter((d) => SCHEMA_MODELS.has(d.kind))

/** Parameters typed as a plain number or a quantity (lists and nested models are not offered here). */
function offeredParameters(d: PropagationModelDescriptor): ModelParameterDescriptor[] {
  const keys = SCHEMA_MODELS.get(d.kind) ?? new Set<string>()
  return d.parameters.filter((p) => keys.has(p.key) && p.key !== 'exponentChanges' && p.key !== 'base' && p.unit !== '1/km')
}

function defaultWords(p: ModelParameterDescriptor): string | undefined {
  if (p.defaultValue === undefined) return undefined
  const choice = p.choices?.find((c) => c.value === p.defaultValue)
  return `Default: ${choice ? choice.label : `${p.defaultValue}${p.unit ? ` ${p.unit}` : ''}`}.`
}

function ParameterField({ prefix, p }: { prefix: string; p: ModelParameterDescriptor }) {
  const path = `${prefix}.${p.key}`
  const hint = [p.help, defaultWords(p)].filter(Boolean).join(' ') || undefined
  const optional = !p.required
  if (p.choices) {
    const options = [...(p.required ? [] : [{ value: '', label: 'Not given (use the default)' }]), ...p.choices]
    return <ChoiceField path={path} label={optional ? `${p.label} (optional)` : p.label} options={options} hint={hint} />
  }
  if (p.unit === 'Hz') return <QField path={path} label={p.label} kind="frequency" units={U.freq} hint={hint} optional={optional} />
  if (p.unit === 'm' && /height/i.test(p.key)) return <QField path={path} label={p.label} kind="height" units={U.height} hint={hint} optional={optional} />
  if (p.unit === 'm') return <QField path={path} label={p.label} kind="distance" units={U.distance} hint={hint} optional={optional} />
  if (p.unit === 'dB') return <QField path={path} label={p.label} kind="loss" units={U.db} hint={hint} optional={optional} />
  if (p.unit === 'dB/km') return <QField path={path} label={p.label} kind="specificAttenuation" units={['dB/km']} hint={hint} optional={optional} />
  return <QField path={path} label={p.label} kind="loss" units={U.plain} hint={hint} optional={optional} />
}

/** A validity quantity's key in words: `distanceInWavelengths` → "distance in wavelengths", `freqHz` → "frequency". */
function words(key: string): string {
  const known: Record<string, string> = { freqHz: 'frequency', distanceM: 'distance', distanceKm: 'distance', txHeightM: 'transmitter height', rxHeightM: 'receiver height' }
  return known[key] ?? key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase()
}

/** The form entries of a newly chosen model: its kind, and its parameters' defaults filled in. */
export function modelDefaults(state: FormState, prefix: string, kind: string): FormState {
  const d = OFFERED_MODELS.find((m) => m.kind === kind)
  const next: FormState = { ...withoutBranch(state, prefix), [`${prefix}.kind`]: kind }
  for (const p of d ? offeredParameters(d) : []) {
    if (p.defaultValue !== undefined && p.required) next[`${prefix}.${p.key}`] = String(p.defaultValue)
  }
  return next
}

/** The spec's inputs as the schema reads them (numbers as "figure unit"). */
export function modelInputs(state: FormState, prefix: string, read: (path: string, units: readonly string[]) => string | undefined): Record<string, unknown> {
  const kind = state[`${prefix}.kind`] ?? OFFERED_MODELS[0]?.kind
  const d = OFFERED_MODELS.find((m) => m.kind === kind)
  const out: Record<string, unknown> = { kind }
  for (const p of d ? offeredParameters(d) : []) {
    const path = `${prefix}.${p.key}`
    if (p.choices) {
      const v = state[path] ?? (p.required ? p.choices[0]?.value : undefined)
      if (v) out[p.key] = v
      continue
    }
    const units = p.unit === 'Hz' ? U.freq : p.unit === 'm' ? (/height/i.test(p.key) ? U.height : U.distance) : p.unit === 'dB' ? U.db : p.unit === 'dB/km' ? ['dB/km'] : U.plain
    const v = read(path, units)
    if (v !== undefined) out[p.key] = v
  }
  return out
}

export function ModelChooser({ prefix = 'model' }: { prefix?: string }) {
  const { state } = useEstimateForm()
  const kind = state[`${prefix}.kind`] ?? OFFERED_MODELS[0]?.kind ?? ''
  const d = OFFERED_MODELS.find((m) => m.kind === kind)
  return (
    <div className="flex min-w-0 flex-col gap-4 md:col-span-2">
      <ChoiceField
        path={`${prefix}.kind`}
        label="Propagation model"
        options={OFFERED_MODELS.map((m) => ({ value: m.kind, label: m.label }))}
        onPick={(k) => modelDefaults(state, prefix, k)}
      />
      {d && (
        <div className="rounded-control border border-rule bg-paper px-4 py-3 text-sm">
          <p>{d.summary}</p>
          {(d.validity.length > 0 || d.validityNote) && (
            <div className="mt-2">
              <p className="font-semibold">Valid for</p>
              <ul className="list-disc pl-5">
                {d.validity.map((v) => (
                  <li key={`${v.quantity}-${v.min}-${v.max}`}>
                    {words(v.quantity)}: {v.min !== undefined ? fmtBound(v.min, v.unit) : 'any'} to {v.max !== undefined ? fmtBound(v.max, v.unit) : 'any'}{' '}
                    <span className="text-ink-muted">({v.source})</span>
                  </li>
                ))}
                {d.validityNote && <li>{d.validityNote}</li>}
              </ul>
            </div>
          )}
          <p className="mt-2 text-ink-muted">Source: {d.source}</p>
        </div>
      )}
      <div className={FIELD_GRID}>{d && offeredParameters(d).map((p) => <ParameterField key={p.key} prefix={prefix} p={p} />)}</div>
    </div>
  )
}

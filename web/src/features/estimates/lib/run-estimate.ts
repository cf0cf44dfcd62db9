/**
 * One way to run an estimate, two places: on a case the server computes and stores the record
 * (POST /api/cases/:id/calculations); in the quick calculator the same shared kind runs in the
 * browser against the library's own reference list, and nothing is stored. Either way the form
 * gets back the same outcome, or its field errors by input path.
 */
import type { z } from 'zod'
import { CALCULATION_KIND_DEFS, CalculationRefused, LIBRARY_REFERENCES, type Json } from '@shared/calculations'
import { RADIO_LIBRARY_VERSION, type MethodRef } from '@shared/radio'
import type { CalculationView } from '@shared/schemas/views'
import { isApiError } from '@/lib/api-client'
import type { FieldErrors } from './form-state'

export interface EstimateRequest {
  kind: string
  inputs: Record<string, unknown>
}

export interface EstimateOutcome {
  kind: string
  outputs: { value: Json; interval?: { quantity: string; low: number; high: number; basis: string } }
  warnings: string[]
  methods: MethodRef[]
  libraryVersion: string
  summary?: string
  references?: Record<string, Json>
  /** The stored record, when the server stored one. */
  record?: CalculationView
}

export type RunEstimate = (request: EstimateRequest) => Promise<EstimateOutcome>

/** The inputs were refused: errors beside the fields, and what belongs to no field. */
export class EstimateInputError extends Error {
  readonly fieldErrors: FieldErrors
  readonly otherProblems: string[]
  constructor(message: string, fieldErrors: FieldErrors = {}, otherProblems: string[] = []) {
    super(message)
    this.fieldErrors = fieldErrors
    this.otherProblems = otherProblems
  }
}

/** Issues by path (first message per path wins, as the form shows one per field). */
export function errorsByPath(issues: { path: string; message: string }[]): FieldErrors {
  const out: FieldErrors = {}
  for (const i of issues) if (!(i.path in out)) out[i.path] = i.message
  return out
}

interface AnyKindDef {
  inputSchema: z.ZodType
  references(inputs: unknown, lookup: typeof LIBRARY_REFERENCES): Record<string, Json>
  run(inputs: unknown, references: Record<string, unknown>): { outputs: EstimateOutcome['outputs']; warnings: string[]; methods: MethodRef[]; summary: string }
}

const KIND_DEFS = CALCULATION_KIND_DEFS as unknown as Record<string, AnyKindDef | undefined>

/** The kinds the browser can run (those the shared registry defines). */
export const knownKind = (kind: string) => KIND_DEFS[kind] !== undefined

/** Runs a kind in the browser: the same schema and run the server uses, the library's own references. */
export const runInBrowser: RunEstimate = async (request) => computeInBrowser(request)

/** The same, synchronously (a shared link's result is computed as the page opens). */
export function computeInBrowser({ kind, inputs }: EstimateRequest): EstimateOutcome {
  const def = KIND_DEFS[kind]
  if (!def) throw new EstimateInputError(`This page cannot run "${kind}".`)
  const parsed = def.inputSchema.safeParse(inputs)
  if (!parsed.success) {
    throw new EstimateInputError(
      'Some fields need attention.',
      errorsByPath(parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))),
    )
  }
  try {
    const references = def.references(parsed.data, LIBRARY_REFERENCES)
    const r = def.run(parsed.data, references)
    return { kind, outputs: r.outputs, warnings: r.warnings, methods: r.methods, summary: r.summary, references, libraryVersion: RADIO_LIBRARY_VERSION }
  } catch (e) {
    if (e instanceof CalculationRefused) throw new EstimateInputError(e.message)
    throw e
  }
}

/** The server's refusal as field errors: details paths are `inputs.<path>`. */
export function inputErrorFromApi(error: unknown): EstimateInputError | null {
  if (!isApiError(error) || error.status !== 400) return null
  const fieldIssues = error.details.filter((d) => d.path.startsWith('inputs.')).map((d) => ({ path: d.path.slice('inputs.'.length), message: d.message }))
  const other = error.details.filter((d) => !d.path.startsWith('inputs.')).map((d) => d.message)
  return new EstimateInputError(error.message, errorsByPath(fieldIssues), error.details.length === 0 ? [] : other)
}

/** A stored record as an outcome. */
export function outcomeOfRecord(record: CalculationView): EstimateOutcome {
  return {
    kind: record.kind,
    outputs: record.outputs,
    warnings: record.warnings,
    methods: record.methods,
    libraryVersion: record.libraryVersion,
    references: record.references,
    record,
  }
}
